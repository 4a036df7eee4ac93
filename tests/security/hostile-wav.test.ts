import request from 'supertest';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import {
  concat,
  cueBombFile,
  float32Body,
  fmtBody,
  impulseSamples,
  pcm16Body,
  riffFile,
  smplBody,
  words,
  type ChunkSpec,
} from '../../shared/analysis/wav-test-files';
import { expectProblem } from '../api/calculation-helpers';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectAnswered } from '../support/presentation';

// Hand-made WAV files that once froze the service (a walk over declared counts) or passed absurd values
// through; each must be refused at once with a problem naming the file, on every route that takes a WAV.

let ctx: TestContext;
let roomId: string;
beforeAll(async () => {
  ctx = await createTestContext();
  const res = await request(ctx.app)
    .post('/v1/rooms')
    .set('Authorization', `Bearer ${ctx.keys.tuning}`)
    .send(structuredClone({ ...STAGE3_ROOM }));
  roomId = res.body.id;
});
afterAll(async () => {
  await ctx.close();
});

const fmt = (spec = {}): ChunkSpec => ({ id: 'fmt ', body: fmtBody(spec) });
const data: ChunkSpec = { id: 'data', body: pcm16Body([impulseSamples(4800, 100)]) };
const withChunk = (chunk: ChunkSpec) => Buffer.from(riffFile({ chunks: [fmt(), chunk, data] }));
const floatFile = (value: number) => {
  const samples = impulseSamples(4800, 100);
  samples[200] = value;
  return Buffer.from(
    riffFile({
      chunks: [fmt({ formatCode: 3, bitsPerSample: 32 }), { id: 'data', body: float32Body(samples) }],
    }),
  );
};

const files: Array<[string, Buffer, string]> = [
  [
    'the reported 9,656-byte file (cue chunk declaring 0xFFFFFFFF points)',
    Buffer.from(cueBombFile()),
    'malformed',
  ],
  [
    'a smpl chunk declaring 0xFFFFFFFF loops',
    withChunk({ id: 'smpl', body: smplBody(0xffffffff) }),
    'malformed',
  ],
  [
    'a smpl chunk declaring 0xFFFFFFFF bytes of sampler data',
    withChunk({ id: 'smpl', body: smplBody(0, 0xffffffff) }),
    'malformed',
  ],
  [
    'a LIST entry declaring 0xFFFFFFF0 bytes',
    withChunk({
      id: 'LIST',
      body: concat([Uint8Array.from('INFOINAM', (c) => c.charCodeAt(0)), words(0xfffffff0)]),
    }),
    'malformed',
  ],
  ['an inst chunk of 3 bytes', withChunk({ id: 'inst', body: new Uint8Array(3) }), 'malformed'],
  ['a bext chunk of 16 bytes', withChunk({ id: 'bext', body: new Uint8Array(16) }), 'malformed'],
  [
    'a JUNK chunk declaring 0xFFFFFFFF bytes',
    withChunk({ id: 'JUNK', body: new Uint8Array(4), declaredSize: 0xffffffff }),
    'malformed',
  ],
  [
    'a format chunk declaring 0xFFFFFFFF bytes',
    Buffer.from(riffFile({ chunks: [{ ...fmt(), declaredSize: 0xffffffff }, data] })),
    'malformed',
  ],
  [
    'a data chunk declaring 0x7FFFFFFF bytes',
    Buffer.from(riffFile({ chunks: [fmt(), { ...data, declaredSize: 0x7fffffff }] })),
    'truncated',
  ],
  [
    'zero channels',
    Buffer.from(riffFile({ chunks: [fmt({ channels: 0, blockAlign: 2 }), data] })),
    'malformed',
  ],
  [
    'a sample rate of 4,294,967,295 Hz',
    Buffer.from(riffFile({ chunks: [fmt({ sampleRateHz: 0xffffffff }), data] })),
    'unsupportedSampleRate',
  ],
  [
    'a sample rate of 0 Hz',
    Buffer.from(riffFile({ chunks: [fmt({ sampleRateHz: 0 }), data] })),
    'unsupportedSampleRate',
  ],
  [
    '12 bits per sample',
    Buffer.from(riffFile({ chunks: [fmt({ bitsPerSample: 12, blockAlign: 2 }), data] })),
    'unsupportedEncoding',
  ],
  [
    '64-bit float',
    Buffer.from(riffFile({ chunks: [fmt({ formatCode: 3, bitsPerSample: 64 }), data] })),
    'unsupportedEncoding',
  ],
  ['a float sample of 3e38', floatFile(3e38), 'invalidSamples'],
  ['a float sample of −3e38', floatFile(-3e38), 'invalidSamples'],
  ['a NaN sample', floatFile(Number.NaN), 'invalidSamples'],
  ['an infinite sample', floatFile(Number.POSITIVE_INFINITY), 'invalidSamples'],
];

describe.each([
  ['POST /v1/analysis/impulse-response', () => '/v1/analysis/impulse-response', () => ctx.keys.calculate, {}],
  [
    'POST /v1/rooms/{roomId}/measurements',
    () => `/v1/rooms/${roomId}/measurements`,
    () => ctx.keys.tuning,
    { channel: 'M+000', micPosition: 'MLP' },
  ],
])('%s refuses hostile WAV files at once', (_route, path, key, fields) => {
  it.each(files)('%s', async (_name, file, reason) => {
    let call = request(ctx.app).post(path()).set('Authorization', `Bearer ${key()}`);
    for (const [name, value] of Object.entries(fields as Record<string, string>))
      call = call.field(name, value);
    const res = await call.attach('file', file, 'capture.wav');
    expectProblem(res, 422, '/body/file');
    expect(res.body).toMatchObject({ type: 'https://isochron.dev/problems/unusable-audio', reason });
    // The service still answers other requests afterwards.
    expect((await request(ctx.app).get('/healthz')).status).toBe(200);
  });
});

it('stores nothing for a refused measurement upload', async () => {
  const list = () =>
    request(ctx.app)
      .get(`/v1/rooms/${roomId}/measurements`)
      .set('Authorization', `Bearer ${ctx.keys.tuning}`);
  const before = (await list()).body.data.length;
  await request(ctx.app)
    .post(`/v1/rooms/${roomId}/measurements`)
    .set('Authorization', `Bearer ${ctx.keys.tuning}`)
    .field('channel', 'M+000')
    .attach('file', Buffer.from(cueBombFile()), 'capture.wav');
  expect((await list()).body.data.length).toBe(before);
});

it('analyses a float file above full scale as it is, with a warning', async () => {
  const res = await request(ctx.app)
    .post('/v1/analysis/impulse-response')
    .set('Authorization', `Bearer ${ctx.keys.calculate}`)
    .attach('file', floatFile(4), 'capture.wav');
  expect(res.status).toBe(200);
  // The peak is the sample of 4.0: 20·log10(4) = 12.04 dBFS.
  expectAnswered(res.body.level.peakDbfs, 20 * Math.log10(4), 'db');
  expect(res.body.warnings).toContainEqual(expect.objectContaining({ code: 'aboveFullScale' }));
});
