import type { AddressInfo } from 'node:net';
import express from 'express';
import { serveUntilStopped } from './protocol';

// (B) The framework alone: Express 5 with its JSON body parser, echoing the body.
const app = express();
app.use(express.json());
app.post('/echo', (req, res) => {
  res.json(req.body);
});

const server = app.listen(0, '127.0.0.1', () => {
  serveUntilStopped((server.address() as AddressInfo).port, {}, async () => {
    await new Promise((resolve) => server.close(resolve));
    return {};
  });
});
