import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { serveUntilStopped } from './protocol';

// (A) The floor: node:http parsing a JSON body and writing it back, nothing else.
const server = http.createServer((req, res) => {
  const chunks: Buffer[] = [];
  req.on('data', (chunk: Buffer) => chunks.push(chunk));
  req.on('end', () => {
    let body: string;
    try {
      body = JSON.stringify(JSON.parse(Buffer.concat(chunks).toString('utf8')));
    } catch {
      res.writeHead(400).end();
      return;
    }
    res.writeHead(200, { 'Content-Type': 'application/json', 'Content-Length': Buffer.byteLength(body) });
    res.end(body);
  });
});

server.listen(0, '127.0.0.1', () => {
  serveUntilStopped((server.address() as AddressInfo).port, {}, async () => {
    await new Promise((resolve) => server.close(resolve));
    return {};
  });
});
