import express, { type Express } from 'express';
import request from 'supertest';
import { presentationReplacer } from '../../shared/present';
import { presentNumbersInAnswers } from './present';

/** What an answer looks like on the wire, but the date. */
async function answer(app: Express, method: 'get' | 'head' | 'post', path: string) {
  const agent = request(app);
  const res = await agent[method](path)
    .buffer(true)
    .parse((r, done) => {
      let text = '';
      r.on('data', (chunk: Buffer) => (text += chunk.toString('utf8')));
      r.on('end', () => done(null, text));
    });
  const { date: _date, ...headers } = res.headers;
  return { status: res.status, headers, body: res.body as string };
}

/** The same routes on two apps: Express's own res.json (with the rounding replacer) and ours. */
function apps(): [Express, Express] {
  const build = (ours: boolean) => {
    const app = express();
    app.set('etag', false);
    if (ours) presentNumbersInAnswers(app);
    else app.set('json replacer', presentationReplacer);
    app.all('/plain', (_req, res) => res.json({ delayMs: 1.234567891, b0: 0.123456789012, note: 'ä <b>' }));
    app.all('/created', (_req, res) =>
      res.status(201).location('/x/1').json({ id: 'x_1', trimDb: -3.14159 }),
    );
    app.all('/problem', (_req, res) =>
      res.status(422).type('application/problem+json').json({ status: 422, title: 'Unprocessable' }),
    );
    app.all('/typed', (_req, res) => res.type('application/json; charset=utf-8').json([1, 2]));
    app.all('/none', (_req, res) => res.status(204).json({ gone: true }));
    app.all('/reset', (_req, res) => res.status(205).json({ gone: true }));
    app.all('/null', (_req, res) => res.json(null));
    app.all('/undefined', (_req, res) => res.json(undefined));
    app.all('/string', (_req, res) => res.json('text'));
    return app;
  };
  return [build(false), build(true)];
}

describe('presentNumbersInAnswers (res.json)', () => {
  const [theirs, ours] = apps();
  const cases = [
    '/plain',
    '/created',
    '/problem',
    '/typed',
    '/none',
    '/reset',
    '/null',
    '/undefined',
    '/string',
  ];

  const methods = ['get', 'head', 'post'] as const;
  it.each(
    cases.flatMap((path) => methods.map((method): [(typeof methods)[number], string] => [method, path])),
  )('answers %s %s with the status, headers and body Express would', async (method, path) => {
    const [expected, actual] = await Promise.all([answer(theirs, method, path), answer(ours, method, path)]);
    expect(actual).toEqual(expected);
  });

  it('rounds unit-named numbers and keeps the rest at full precision', async () => {
    const { body, headers } = await answer(ours, 'get', '/plain');
    expect(JSON.parse(body)).toEqual({ delayMs: 1.2346, b0: 0.123456789012, note: 'ä <b>' });
    expect(headers['content-type']).toBe('application/json; charset=utf-8');
    expect(Number(headers['content-length'])).toBe(Buffer.byteLength(body));
  });
});
