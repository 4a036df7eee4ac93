import { WaveFile } from 'wavefile';
import { SignalProblemError } from './signal-problem';
import { decodeWav } from './wav-decode';

/** Channel c of the test signal: a sine of amplitude 0.1·(c + 1), so every channel differs. */
const signal = (channel: number, frames: number): number[] =>
  Array.from({ length: frames }, (_, i) => 0.1 * (channel + 1) * Math.sin((2 * Math.PI * i) / 37));

const FULL_SCALE: Record<string, number> = { '16': 32768, '24': 8388608, '32': 2147483648 };

/** Encodes the test signal with wavefile (integer PCM takes integer sample values). */
function encode(
  bitDepth: string,
  channels: number,
  sampleRateHz: number,
  frames = 480,
  container?: 'RIFX',
): Uint8Array {
  const data = Array.from({ length: channels }, (_, c) =>
    signal(c, frames).map((v) => (bitDepth in FULL_SCALE ? Math.round(v * FULL_SCALE[bitDepth]) : v)),
  );
  const wav = new WaveFile();
  wav.fromScratch(
    channels,
    sampleRateHz,
    bitDepth,
    channels === 1 ? data[0] : data,
    container ? { container } : undefined,
  );
  return wav.toBuffer();
}

/** A WAVE_FORMAT_EXTENSIBLE float file written byte by byte (layout of the Microsoft WAVEFORMATEXTENSIBLE). */
function extensibleFloat(channels: number, sampleRateHz: number, samples: number[][]): Uint8Array {
  const frames = samples[0].length;
  const dataBytes = frames * channels * 4;
  const buffer = new ArrayBuffer(12 + 8 + 40 + 8 + dataBytes);
  const view = new DataView(buffer);
  const text = (offset: number, s: string) =>
    [...s].forEach((ch, i) => view.setUint8(offset + i, ch.charCodeAt(0)));
  text(0, 'RIFF');
  view.setUint32(4, buffer.byteLength - 8, true);
  text(8, 'WAVE');
  text(12, 'fmt ');
  view.setUint32(16, 40, true);
  view.setUint16(20, 0xfffe, true);
  view.setUint16(22, channels, true);
  view.setUint32(24, sampleRateHz, true);
  view.setUint32(28, sampleRateHz * channels * 4, true);
  view.setUint16(32, channels * 4, true);
  view.setUint16(34, 32, true);
  view.setUint16(36, 22, true);
  view.setUint16(38, 32, true);
  view.setUint32(40, 0, true);
  // KSDATAFORMAT_SUBTYPE_IEEE_FLOAT {00000003-0000-0010-8000-00AA00389B71}
  [3, 0, 0, 0, 0, 0, 0x10, 0, 0x80, 0, 0, 0xaa, 0, 0x38, 0x9b, 0x71].forEach((b, i) =>
    view.setUint8(44 + i, b),
  );
  text(60, 'data');
  view.setUint32(64, dataBytes, true);
  for (let i = 0; i < frames; i++) {
    for (let c = 0; c < channels; c++) view.setFloat32(68 + (i * channels + c) * 4, samples[c][i], true);
  }
  return new Uint8Array(buffer);
}

function expectProblem(fn: () => unknown, code: string, message: RegExp, field = '/file'): void {
  let caught: unknown;
  try {
    fn();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(SignalProblemError);
  expect((caught as SignalProblemError).code).toBe(code);
  expect((caught as SignalProblemError).field).toBe(field);
  expect((caught as Error).message).toMatch(message);
}

describe('WAV decoding (one channel decoded to ±1 full scale; files written by wavefile)', () => {
  const cases: Array<[string, number, number, number]> = [];
  for (const bitDepth of ['16', '24', '32', '32f']) {
    for (const rate of [44100, 48000, 96000, 192000]) cases.push([bitDepth, 1, rate, 0]);
    cases.push([bitDepth, 2, 48000, 1], [bitDepth, 6, 96000, 4]);
  }

  it.each(cases)(
    'decodes %s-bit, %i channel(s) at %i Hz, channel %i',
    (bitDepth, channels, rate, channel) => {
      const decoded = decodeWav(encode(bitDepth, channels, rate), channels > 1 ? { channel } : {});
      expect(decoded).toMatchObject({
        sampleRateHz: rate,
        channelCount: channels,
        channelIndex: channel,
        frameCount: 480,
      });
      expect(decoded.encoding).toBe(bitDepth === '32f' ? 'float32' : `pcm${bitDepth}`);
      expect(decoded.durationS).toBeCloseTo(480 / rate, 12);
      // Quantisation: half a step of the integer format; float32 keeps about 7 significant digits.
      const tolerance = bitDepth in FULL_SCALE ? 0.5 / FULL_SCALE[bitDepth] + 1e-15 : 1e-7;
      signal(channel, 480).forEach((v, i) =>
        expect(Math.abs(decoded.samples[i] - v)).toBeLessThanOrEqual(tolerance),
      );
    },
  );

  it('decodes negative full scale and the largest positive code exactly (16-bit: −1 and 32767/32768)', () => {
    const wav = new WaveFile();
    wav.fromScratch(1, 48000, '16', [-32768, 32767, 0, -1]);
    expect(Array.from(decodeWav(wav.toBuffer()).samples)).toEqual([-1, 32767 / 32768, 0, -1 / 32768]);
    const wav24 = new WaveFile();
    wav24.fromScratch(1, 48000, '24', [-8388608, 8388607, -1]);
    expect(Array.from(decodeWav(wav24.toBuffer()).samples)).toEqual([-1, 8388607 / 8388608, -1 / 8388608]);
  });

  it('reads big-endian RIFX files', () => {
    const decoded = decodeWav(encode('24', 1, 48000, 480, 'RIFX'));
    signal(0, 480).forEach((v, i) =>
      expect(Math.abs(decoded.samples[i] - v)).toBeLessThanOrEqual(0.5 / 8388608),
    );
  });

  it('reads WAVE_FORMAT_EXTENSIBLE float files by their sub-format', () => {
    const samples = [signal(0, 100), signal(1, 100), signal(2, 100)];
    const decoded = decodeWav(extensibleFloat(3, 48000, samples), { channel: 2 });
    expect(decoded.encoding).toBe('float32');
    samples[2].forEach((v, i) => expect(Math.abs(decoded.samples[i] - v)).toBeLessThanOrEqual(1e-7));
  });

  describe('refuses bad files with the reason', () => {
    it('empty file', () => expectProblem(() => decodeWav(new Uint8Array(0)), 'emptyFile', /empty/));
    it('not a WAV file', () =>
      expectProblem(
        () => decodeWav(new TextEncoder().encode('frequency,dB\n20,80\n')),
        'notWav',
        /not a WAV/,
      ));
    it('truncated data', () => {
      const bytes = encode('16', 1, 48000);
      expectProblem(
        () => decodeWav(bytes.subarray(0, bytes.length - 100)),
        'truncated',
        /declares 960 bytes but only 860/,
      );
    });
    it('truncated header', () =>
      expectProblem(
        () => decodeWav(encode('16', 1, 48000).subarray(0, 30)),
        'truncated',
        /truncated: the 'fmt ' chunk at byte 12 declares 16 bytes but only 10 remain/,
      ));
    it('no audio frames', () => {
      const wav = new WaveFile();
      wav.fromScratch(1, 48000, '16', []);
      expectProblem(() => decodeWav(wav.toBuffer()), 'emptyFile', /no audio frames/);
    });
    it.each(['8', '64'])('unsupported %s-bit encoding', (bitDepth) =>
      expectProblem(
        () => decodeWav(encode(bitDepth, 1, 48000)),
        'unsupportedEncoding',
        /not supported; use PCM 16, 24 or 32/,
      ),
    );
    it.each([22050, 32000, 384000])('sample rate %i Hz', (rate) =>
      expectProblem(
        () => decodeWav(encode('16', 1, rate)),
        'unsupportedSampleRate',
        new RegExp(`44100..192000 Hz; the file has ${rate}`),
      ),
    );
    it('too long', () =>
      expectProblem(
        () =>
          decodeWav(encode('16', 1, 48000, 48000), {
            limits: { maxDurationS: 0.5, minSampleRateHz: 44100, maxSampleRateHz: 192000 },
          }),
        'tooLong',
        /lasts 1.00 s; files may last at most 0.5 s/,
      ));
    it('multichannel without a channel', () =>
      expectProblem(
        () => decodeWav(encode('16', 2, 48000)),
        'channelRequired',
        /2 channels; say which one/,
        '/channel',
      ));
    it.each([2, -1, 0.5])('channel %p of a stereo file', (channel) =>
      expectProblem(
        () => decodeWav(encode('16', 2, 48000), { channel }),
        'channelOutOfRange',
        /integer 0..1/,
        '/channel',
      ),
    );
    it('non-finite float samples', () => {
      const samples = [[0, Number.NaN, 0]];
      expectProblem(
        () => decodeWav(extensibleFloat(1, 48000, samples)),
        'invalidSamples',
        /Sample 1 of channel 0/,
      );
    });
  });
});
