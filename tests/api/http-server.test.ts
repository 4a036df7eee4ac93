import type http from 'node:http';
import request from 'supertest';
import { WaveFile } from 'wavefile';
import { createServer } from '../../api/http/server';
import { createTestContext, type TestContext } from '../support/test-context';

// The service's server builds requests and answers with every field the API's stages set declared up
// front (api/http/server.ts), so each has one shape. Here: it answers as the app does, and no API request
// gains a field on its way, whichever stages it passes (JSON, an upload, a parameter, a refusal). The
// console's session routes add their own (passport's methods), and are left out.
/** Node's own: an event emitter counts its event names from the first listener on. */
const NODE_BOOKKEEPING = new Set(['_eventsCount']);
let ctx: TestContext;
let server: http.Server;
/** Field names each request and answer had when built, and the ones they had when answered. */
const seen: Array<{ url: string; built: string[]; answered: string[]; what: 'request' | 'answer' }> = [];

beforeAll(async () => {
  ctx = await createTestContext();
  server = createServer(ctx.app);
  server.prependListener('request', (req: http.IncomingMessage, res: http.ServerResponse) => {
    const url = req.url ?? '';
    const [reqBuilt, resBuilt] = [Object.keys(req), Object.keys(res)];
    if (!/^\/v1\//i.test(url)) return;
    res.on('finish', () => {
      seen.push({ url, what: 'request', built: reqBuilt, answered: Object.keys(req) });
      seen.push({ url, what: 'answer', built: resBuilt, answered: Object.keys(res) });
    });
  });
});
afterAll(async () => {
  await ctx.close();
});

const BIQUADS = {
  sampleRateHz: 48000,
  filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
};

function wav(): Buffer {
  const samples = new Array<number>(4800).fill(0);
  samples[100] = 16000;
  const file = new WaveFile();
  file.fromScratch(1, 48000, '16', samples);
  return Buffer.from(file.toBuffer());
}

describe('the service HTTP server', () => {
  it('answers a calculation as the app does', async () => {
    const send = (target: Parameters<typeof request>[0]) =>
      request(target).post('/v1/biquads').set('Authorization', `Bearer ${ctx.keys.calculate}`).send(BIQUADS);
    const [viaServer, viaApp] = [await send(server), await send(ctx.app)];
    expect(viaServer.status).toBe(200);
    expect(viaServer.body).toEqual(viaApp.body);
  });

  it('gives no request or answer a field it was not built with', async () => {
    const key = `Bearer ${ctx.keys.tuning}`;
    const from = seen.length;
    await request(server).post('/v1/biquads').set('Authorization', key).send(BIQUADS).expect(200);
    await request(server).post('/v1/biquads').set('Authorization', key).send({ sampleRateHz: 1 }).expect(400);
    await request(server).post('/v1/biquads').send(BIQUADS).expect(401);
    await request(server).get('/v1/rooms/room_nothing').set('Authorization', key).expect(404);
    await request(server).get('/v1/nowhere').set('Authorization', key).expect(404);
    await request(server).get('/V1/layouts').set('Authorization', key).expect(200);
    await request(server)
      .post('/v1/analysis/impulse-response')
      .set('Authorization', key)
      .attach('file', wav(), 'ir.wav')
      .expect(200);
    // Seven API requests, each a request and an answer.
    expect(seen.length - from).toBe(14);
    const gained = seen
      .map(({ url, what, built, answered }) => ({
        url,
        what,
        fields: answered.filter((field) => !built.includes(field) && !NODE_BOOKKEEPING.has(field)),
      }))
      .filter(({ fields }) => fields.length > 0);
    expect(gained).toEqual([]);
  });
});
