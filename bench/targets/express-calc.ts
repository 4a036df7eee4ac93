import type { AddressInfo } from 'node:net';
import http from 'node:http';
import express from 'express';
import { createServer, listen } from '../../api/http/server';
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

// BENCH_SERVICE_SERVER=1 (F): the same app on the service's HTTP server instead of Express's own.
const server = listen(
  process.env.BENCH_SERVICE_SERVER === '1' ? createServer(app) : http.createServer(app),
  0,
  '127.0.0.1',
  (error) => {
    if (error) throw error;
    serveUntilStopped((server.address() as AddressInfo).port, {}, async () => {
      await new Promise((resolve) => server.close(resolve));
      return {};
    });
  },
);
