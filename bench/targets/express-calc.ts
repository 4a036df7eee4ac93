import type { AddressInfo } from 'node:net';
import express from 'express';
import { designFilterSet } from '../../shared/filters/filter-set';
import { serveUntilStopped } from './protocol';

// (E) Express 5 alone doing the calculation of POST /v1/biquads: its JSON body parser, the same pure
// function of shared/ and res.json, with none of the chain (no key, limits, metering, validation,
// headers). What the full chain (C) costs beyond the calculation is C against this.
const app = express();
app.use(express.json());
app.post('/v1/biquads', (req, res) => {
  res.json(designFilterSet(req.body as Parameters<typeof designFilterSet>[0]));
});

const server = app.listen(0, '127.0.0.1', () => {
  serveUntilStopped((server.address() as AddressInfo).port, {}, async () => {
    await new Promise((resolve) => server.close(resolve));
    return {};
  });
});
