import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';

const ACCEPTED = /^[A-Za-z0-9._-]{8,64}$/;

/** Every response carries `Request-Id`; a well-formed id sent by the caller is kept for tracing. */
export const requestId: RequestHandler = (req, res, next) => {
  const incoming = req.headers['request-id'];
  const id = typeof incoming === 'string' && ACCEPTED.test(incoming) ? incoming : randomUUID();
  res.setHeader('Request-Id', id);
  next();
};
