import request from 'supertest';
import { WaveFile } from 'wavefile';
import { noisyDecay } from '../../shared/analysis/test-signals';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const FULL_SCALE: Record<string, number> = { '16': 32767, '24': 8388607, '32': 2147483647 };

/** A WAV file encoded here with wavefile; `channels` are ±1 full-scale sample arrays. */
function wav(bitDepth: string, sampleRateHz: number, channels: ArrayLike<number>[]): Buffer {
  const data = channels.map((c) =>
    Array.from(c, (v) => (bitDepth in FULL_SCALE ? Math.round(v * FULL_SCALE[bitDepth]) : v)),
  );
  const file = new WaveFile();
  file.fromScratch(channels.length, sampleRateHz, bitDepth, channels.length === 1 ? data[0] : data);
  return Buffer.from(file.toBuffer());
}

const impulse = (length: number, at: number, amplitude = 0.5): Float64Array => {
  const x = new Float64Array(length);
  x[at] = amplitude;
  return x;
};

function upload(file: Buffer | null, fields: Record<string, string> = {}, name = 'ir.wav', field = 'file') {
  let call = request(ctx.app)
    .post('/v1/analysis/impulse-response')
    .set('Authorization', `Bearer ${ctx.keys.calculate}`);
  for (const [key, value] of Object.entries(fields)) call = call.field(key, value);
  return file ? call.attach(field, file, name) : call;
}

describe('POST /v1/analysis/impulse-response', () => {
  it('finds an impulse at sample 700 at 48 kHz at 14.583 ms (16-bit mono), flat at −6.02 dB', async () => {
    const res = await upload(wav('16', 48000, [impulse(48000, 700)]));
    expect(res.status).toBe(200);
    expectToMatchContract('analyzeImpulseResponse', 200, res.body);
    expect(res.body.arrival.arrivalSample).toBe(700);
    expectAnswered(res.body.arrival.arrivalMs, (700 / 48000) * 1000, 'ms');
    // 0.5 × 32767/32767 → 16383/32768 after 16-bit quantisation: 20·log10(16384/32768) ≈ −6.0206 dB.
    for (const db of res.body.frequencyResponse.magnitudeDb)
      expect(Math.abs(db - 20 * Math.log10(16384 / 32768))).toBeLessThan(0.001);
    expect(res.body.file).toMatchObject({
      sampleRateHz: 48000,
      channelCount: 1,
      channelIndex: 0,
      encoding: 'pcm16',
    });
  });

  it.each([
    ['24', 44100],
    ['32', 96000],
    ['32f', 192000],
  ])('reads %s-bit files at %i Hz', async (bitDepth, rate) => {
    const res = await upload(wav(bitDepth, rate, [impulse(rate / 2, 700)]));
    expect(res.status).toBe(200);
    expectAnswered(res.body.arrival.arrivalMs, (700 / rate) * 1000, 'ms');
    expect(res.body.file.encoding).toBe(bitDepth === '32f' ? 'float32' : `pcm${bitDepth}`);
  });

  it('analyses the chosen channel of a multichannel file, with decay times and the room modes', async () => {
    const t60 = 0.4;
    const decay = noisyDecay({
      sampleRateHz: 48000,
      durationS: 1.5,
      t60S: t60,
      startSample: 960,
      startRms: 0.1,
      noiseDb: -70,
      seed: 21,
    });
    const res = await upload(wav('24', 48000, [impulse(72000, 10), impulse(72000, 20), decay]), {
      channel: '2',
      smoothingOctaves: '0.3333',
      roomWidthM: '6.1',
      roomLengthM: '7.4',
      roomHeightM: '3.05',
      temperatureC: '20',
    });
    expect(res.status).toBe(200);
    expectToMatchContract('analyzeImpulseResponse', 200, res.body);
    expect(res.body.arrival.arrivalMs).toBeGreaterThanOrEqual(20);
    expect(res.body.arrival.arrivalMs).toBeLessThan(21);
    // 5 %: the just-noticeable difference of reverberation time, ISO 3382-1 Annex A (from memory).
    expect(Math.abs(res.body.decay.t30S / t60 - 1)).toBeLessThan(0.05);
    expect(res.body.decay.bands).toHaveLength(8);
    expect(res.body.frequencyResponse.smoothingOctaves).toBeCloseTo(0.3333, 9);
    // First axial mode along the 7.4 m length: c/(2L) = 343.2/14.8 Hz.
    expect(res.body.room.modes[0]).toMatchObject({ nx: 0, ny: 1, nz: 0, kind: 'axial' });
    expectAnswered(res.body.room.modes[0].frequencyHz, 343.2 / 14.8, 'hz');
    expectAnswered(
      res.body.room.schroederFrequencyHz,
      2000 * Math.sqrt(res.body.decay.t30S / (6.1 * 7.4 * 3.05)),
      'hz',
    );
  });

  describe('room modes of any room the contract allows', () => {
    const decay = (t60S: number) =>
      noisyDecay({
        sampleRateHz: 48000,
        durationS: 1.5,
        t60S,
        startSample: 480,
        startRms: 0.1,
        noiseDb: -70,
        seed: 5,
      });
    const cube = (sideM: string) => ({ roomWidthM: sideM, roomLengthM: sideM, roomHeightM: sideM });

    it('answers a 200 m cube (Schroeder frequency far below its lowest mode) with no modes and says why', async () => {
      const res = await upload(wav('24', 48000, [decay(0.4)]), cube('200'));
      expect(res.status).toBe(200);
      expectToMatchContract('analyzeImpulseResponse', 200, res.body);
      // fS = 2000·sqrt(T/V) with V = 8·10⁶ m³ (Kuttruff, Room Acoustics): under 1 Hz; the lowest axial mode is c/(2·200 m).
      const { room } = res.body;
      expectAnswered(room.schroederFrequencyHz, 2000 * Math.sqrt(res.body.decay.t30S / 8e6), 'hz');
      expectAnswered(room.modesLimit.lowestModeHz, 343.2 / 400, 'hz');
      expect(room.schroederFrequencyHz).toBeLessThan(room.modesLimit.lowestModeHz);
      expect(room.modes).toEqual([]);
      expect(room.modesLimit).toMatchObject({
        reason: 'schroederFrequency',
        found: 0,
        listed: 0,
        cutAtHz: null,
      });
      expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('noModesBelowLimit');
    });

    it("lists a small room's modes past 2 kHz up to its Schroeder frequency, cutting the list by count with a word", async () => {
      const res = await upload(wav('24', 48000, [decay(0.4)]), cube('0.5'));
      expect(res.status).toBe(200);
      expectToMatchContract('analyzeImpulseResponse', 200, res.body);
      const { room } = res.body;
      // fS = 2000·sqrt(0.4/0.125) ≈ 3.6 kHz: above the old silent 2 kHz cut.
      expect(room.modesUpToHz).toBeGreaterThan(2000);
      expect(room.modesUpToHz).toBeCloseTo(room.schroederFrequencyHz, 9);
      const last = room.modes[room.modes.length - 1].frequencyHz;
      expect(last).toBeGreaterThan(2000);
      expect(last).toBeLessThanOrEqual(room.modesUpToHz);
      // The cube's modes below fS are counted, not guessed: (c/2L)·sqrt(nx²+ny²+nz²) ≤ fS.
      const unit = 343.2 / 1;
      let expected = 0;
      const n = Math.floor(room.modesUpToHz / unit);
      for (let x = 0; x <= n; x++)
        for (let y = 0; y <= n; y++)
          for (let z = 0; z <= n; z++)
            if (x + y + z > 0 && unit * Math.sqrt(x * x + y * y + z * z) <= room.modesUpToHz) expected++;
      expect(room.modesLimit.found).toBe(expected);
      expect(room.modesLimit.listed).toBe(Math.min(expected, 500));
      expect(expected).toBeGreaterThan(500);
      expect(room.modesLimit.cutAtHz).toBe(last);
      expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('modesTruncated');
    });
  });

  describe('refuses files that cannot be analysed, saying what is wrong', () => {
    const refused = async (
      file: Buffer,
      reason: string,
      detail: RegExp,
      fields: Record<string, string> = {},
      pointer = '/body/file',
    ) => {
      const res = await upload(file, fields);
      expectProblem(res, 422, pointer);
      expect(res.body).toMatchObject({ type: 'https://isochron.dev/problems/unusable-audio', reason });
      expect(res.body.detail).toMatch(detail);
    };

    it('an empty file', () => refused(Buffer.alloc(0), 'emptyFile', /empty \(0 bytes\)/));
    it('a truncated file', () => {
      const whole = wav('16', 48000, [impulse(4800, 100)]);
      return refused(
        whole.subarray(0, whole.length - 1000),
        'truncated',
        /declares 9600 bytes but only 8600/,
      );
    });
    it('a file that is not WAV', () =>
      refused(Buffer.from('Freq(Hz) SPL\n20 80\n'), 'notWav', /not a WAV file/));
    it('a silent file', () => refused(wav('16', 48000, [new Float64Array(4800)]), 'silent', /silent/));
    it('an 8-bit file', () =>
      refused(
        wav(
          '8',
          48000,
          [impulse(4800, 100)].map((c) => c.map((v) => v * 127 + 128)),
        ),
        'unsupportedEncoding',
        /PCM 16, 24 or 32/,
      ));
    it('a 22.05 kHz file', () =>
      refused(wav('16', 22050, [impulse(4800, 100)]), 'unsupportedSampleRate', /44100..192000/));
    it('a file longer than 30 s', () =>
      refused(wav('16', 44100, [impulse(44100 * 31, 100)]), 'tooLong', /at most 30 s/));
    it('a multichannel file without a channel', () =>
      refused(
        wav('16', 48000, [impulse(4800, 1), impulse(4800, 2)]),
        'channelRequired',
        /2 channels/,
        {},
        '/body/channel',
      ));
    it('a channel the file does not have', () =>
      refused(
        wav('16', 48000, [impulse(4800, 1), impulse(4800, 2)]),
        'channelOutOfRange',
        /0..1/,
        { channel: '5' },
        '/body/channel',
      ));
  });

  it('refuses a file over 20 MiB with 413', async () => {
    const res = await upload(Buffer.alloc(20 * 1024 * 1024 + 1));
    expectProblem(res, 413, '/body/file');
  });

  it.each([
    ['no file', null, {}, '/body/file'],
    ['a channel that is not a number', 'wav', { channel: 'left' }, '/body/channel'],
    ['an unknown field', 'wav', { gain: '3' }, '/body/gain'],
    ['smoothing wider than an octave', 'wav', { smoothingOctaves: '2' }, '/body/smoothingOctaves'],
    ['only two room dimensions', 'wav', { roomWidthM: '6', roomLengthM: '7' }, '/body/roomHeightM'],
  ])('refuses %s with 400', async (_name, file, fields, pointer) => {
    const res = await upload(
      file ? wav('16', 48000, [impulse(4800, 100)]) : null,
      fields as Record<string, string>,
    );
    expectProblem(res, 400, pointer);
  });

  it('refuses the file in another field', async () => {
    expectProblem(
      await upload(wav('16', 48000, [impulse(4800, 100)]), {}, 'ir.wav', 'audio'),
      400,
      '/body/audio',
    );
  });

  it('refuses a JSON body with 415', async () => {
    const res = await request(ctx.app)
      .post('/v1/analysis/impulse-response')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`)
      .send({ file: 'UklGRg==' });
    expectProblem(res, 415);
  });

  it('requires a key', async () => {
    const res = await request(ctx.app)
      .post('/v1/analysis/impulse-response')
      .attach('file', wav('16', 48000, [impulse(4800, 100)]), 'ir.wav');
    expect(res.status).toBe(401);
  });
});
