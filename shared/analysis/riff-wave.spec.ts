import { WaveFile } from 'wavefile';
import { MAX_WAVE_CHUNKS, readWaveLayout } from './riff-wave';
import { SignalProblemError } from './signal-problem';
import { decodeWav } from './wav-decode';
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
} from './wav-test-files';

const fmt = (spec = {}): ChunkSpec => ({ id: 'fmt ', body: fmtBody(spec) });
const data = (frames = 480, at = 10): ChunkSpec => ({
  id: 'data',
  body: pcm16Body([impulseSamples(frames, at)]),
});

function refusal(fn: () => unknown): SignalProblemError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(SignalProblemError);
    return error as SignalProblemError;
  }
  throw new Error('expected a refusal');
}

function expectRefused(bytes: Uint8Array, code: string, message: RegExp): void {
  const error = refusal(() => decodeWav(bytes));
  expect(error.code).toBe(code);
  expect(error.field).toBe('/file');
  expect(error.message).toMatch(message);
}

/** The impulse of `data()` must come back at sample 10 with 16-bit value 16384/32768. */
function expectImpulse(bytes: Uint8Array): void {
  const decoded = decodeWav(bytes);
  expect(decoded.frameCount).toBe(480);
  expect(decoded.samples[10]).toBe(0.5);
  expect(decoded.samples.reduce((n, v) => n + Math.abs(v), 0)).toBe(0.5);
}

describe('RIFF/WAVE chunk walk (RIFF specification 1991; EBU Tech 3306 RF64; ITU-R BS.2088 BW64)', () => {
  describe('reads well-formed files whatever else they carry', () => {
    it('cue points, LIST/INFO tags, a bext chunk, a sampler loop and iXML written by wavefile (an independent writer)', () => {
      const wav = new WaveFile();
      wav.fromScratch(
        1,
        48000,
        '16',
        Array.from(impulseSamples(480, 10), (v) => v * 32768),
      );
      wav.setCuePoint({ position: 1, label: 'sweep start' });
      wav.setCuePoint({ position: 5, label: 'sweep end' });
      wav.setTag('ICMT', 'demo data: invented');
      wav.setiXML('<BWFXML><NOTE>demo</NOTE></BWFXML>');
      (wav as unknown as { bext: Record<string, unknown> }).bext.chunkId = 'bext';
      Object.assign((wav as unknown as { smpl: Record<string, unknown> }).smpl, {
        chunkId: 'smpl',
        dwNumSampleLoops: 1,
        loops: [{ dwName: 1, dwType: 0, dwStart: 0, dwEnd: 100, dwFraction: 0, dwPlayCount: 0 }],
      });
      const bytes = wav.toBuffer();
      const ids = readWaveLayout(bytes).chunks.map((c) => c.id);
      expect(ids).toEqual(expect.arrayContaining(['fmt ', 'data', 'cue ', 'LIST', 'bext', 'smpl', 'iXML']));
      expectImpulse(bytes);
    });

    it('odd-sized chunks with their pad byte, and a final chunk missing it', () => {
      const junk = { id: 'JUNK', body: new Uint8Array(3).fill(7) };
      expectImpulse(riffFile({ chunks: [fmt(), junk, data()] }));
      const layout = readWaveLayout(riffFile({ chunks: [fmt(), data(), { ...junk, noPad: true }] }));
      expect(layout.chunks.map((c) => c.id)).toEqual(['fmt ', 'data', 'JUNK']);
    });

    it('inst, fact, LIST and cue chunks whose counts fit their sizes, and data before fmt', () => {
      const list = concat([Uint8Array.from('INFOICMT', (c) => c.charCodeAt(0)), words(5), new Uint8Array(6)]);
      expectImpulse(
        riffFile({
          chunks: [
            data(),
            { id: 'inst', body: new Uint8Array(7) },
            { id: 'fact', body: words(480) },
            { id: 'LIST', body: list },
            { id: 'cue ', body: concat([words(1), new Uint8Array(24)]) },
            { id: 'smpl', body: smplBody(2, 4, 2, 4) },
            fmt(),
          ],
        }),
      );
    });

    it('bytes after the RIFF form, and zero padding inside it, are ignored', () => {
      const file = riffFile({
        chunks: [fmt(), data()],
        trailing: Uint8Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9]),
      });
      expectImpulse(file);
      const padded = riffFile({ chunks: [fmt(), data()], trailing: new Uint8Array(4) });
      new DataView(padded.buffer).setUint32(4, padded.length - 8, true);
      expectImpulse(padded);
    });

    it('a recorder that never wrote its sizes (0xFFFFFFFF in the RIFF and data headers)', () => {
      expectImpulse(
        riffFile({ chunks: [fmt(), { ...data(), declaredSize: 0xffffffff }], riffSize: 0xffffffff }),
      );
    });

    it.each(['RF64', 'BW64'] as const)('%s with its sizes in a ds64 chunk', (container) => {
      const samples = data();
      // ds64: riffSize, dataSize, sampleCount (64-bit each), table length, one table entry for JUNK.
      const junkSize = 10;
      const formSize = 4 + (8 + 40) + (8 + 16) + (8 + junkSize) + (8 + samples.body.length);
      const ds64 = concat([
        words(formSize, 0, samples.body.length, 0, 480, 0, 1),
        Uint8Array.from('JUNK', (c) => c.charCodeAt(0)),
        words(junkSize, 0),
      ]);
      const file = riffFile({
        container,
        riffSize: 0xffffffff,
        chunks: [
          { id: 'ds64', body: ds64 },
          fmt(),
          { id: 'JUNK', body: new Uint8Array(junkSize), declaredSize: 0xffffffff },
          { ...samples, declaredSize: 0xffffffff },
        ],
      });
      expect(readWaveLayout(file).container).toBe(container);
      expectImpulse(file);
    });

    it('WAVE_FORMAT_EXTENSIBLE 24 valid bits in a 32-bit container', () => {
      const body = new Uint8Array(480 * 4);
      new DataView(body.buffer).setInt32(40, 0x40000000, true);
      const decoded = decodeWav(
        riffFile({
          chunks: [
            fmt({ extensibleSubformat: 1, bitsPerSample: 32, validBitsPerSample: 24 }),
            { id: 'data', body },
          ],
        }),
      );
      expect(decoded.encoding).toBe('pcm32');
      expect(decoded.samples[10]).toBe(0.5);
    });
  });

  describe('refuses hostile or broken structure before reading it', () => {
    it('the reported file: 9,656 bytes, a cue chunk declaring 0xFFFFFFFF cue points', () => {
      const file = cueBombFile();
      expect(file.length).toBe(9656);
      expectRefused(
        file,
        'malformed',
        /'cue ' chunk at byte 36 is 28 bytes but its 4294967295 declared cue points need 103079215084/,
      );
    });

    it.each([
      [
        'smpl with 0xFFFFFFFF loops',
        { id: 'smpl', body: smplBody(0xffffffff) },
        /'smpl' chunk .* 4294967295 declared loops/,
      ],
      [
        'smpl with 0xFFFFFFFF bytes of sampler data',
        { id: 'smpl', body: smplBody(0, 0xffffffff) },
        /4294967295 bytes of sampler data/,
      ],
      [
        'smpl shorter than its header',
        { id: 'smpl', body: new Uint8Array(20) },
        /'smpl' chunk .* is 20 bytes but its header needs 36/,
      ],
      ['cue shorter than its count', { id: 'cue ', body: new Uint8Array(2) }, /'cue ' chunk .* is 2 bytes/],
      ['inst of 3 bytes', { id: 'inst', body: new Uint8Array(3) }, /'inst' chunk .* its seven fields need 7/],
      [
        'bext of 100 bytes',
        { id: 'bext', body: new Uint8Array(100) },
        /'bext' chunk .* its fixed fields need 602/,
      ],
      ['fact of 2 bytes', { id: 'fact', body: new Uint8Array(2) }, /'fact' chunk .* is 2 bytes/],
      ['LIST without a list type', { id: 'LIST', body: new Uint8Array(2) }, /'LIST' chunk .* too short/],
      [
        'LIST whose entry overruns it',
        {
          id: 'LIST',
          body: concat([
            Uint8Array.from('INFOINAM', (c) => c.charCodeAt(0)),
            words(0xfffffff0),
            new Uint8Array(4),
          ]),
        },
        /'INAM' entry .* declares 4294967280 bytes but only 4 remain in the list/,
      ],
      [
        'JUNK declaring 0xFFFFFFFF bytes',
        { id: 'JUNK', body: new Uint8Array(4), declaredSize: 0xffffffff },
        /'JUNK' chunk at byte 36 declares 4294967295 bytes but only \d+ remain/,
      ],
      [
        'LIST declaring more than the file',
        { id: 'LIST', body: new Uint8Array(8), declaredSize: 1 << 30 },
        /'LIST' chunk .* declares 1073741824 bytes/,
      ],
    ])('%s', (_name, chunk, message) => {
      expectRefused(riffFile({ chunks: [fmt(), chunk as ChunkSpec, data()] }), 'malformed', message);
    });

    it.each([
      [
        'a data chunk larger than the file',
        [fmt(), { ...data(), declaredSize: 0x7fffffff }],
        'truncated',
        /data chunk declares 2147483647 bytes but only 960/,
      ],
      [
        'a format chunk larger than the file',
        [{ ...fmt(), declaredSize: 0xffffffff }, data()],
        'malformed',
        /'fmt ' chunk at byte 12 declares 4294967295 bytes/,
      ],
      [
        'a format chunk of 12 bytes',
        [{ id: 'fmt ', body: new Uint8Array(12) }, data()],
        'malformed',
        /format chunk is 12 bytes; at least 16/,
      ],
      ['two format chunks', [fmt(), fmt(), data()], 'malformed', /second 'fmt ' chunk/],
      ['two data chunks', [fmt(), data(), data()], 'malformed', /second data chunk/],
      ['no format chunk', [data()], 'truncated', /no format chunk/],
      ['no data chunk', [fmt()], 'truncated', /no data chunk/],
      [
        'a ds64 chunk in a plain RIFF file',
        [fmt(), { id: 'ds64', body: new Uint8Array(28) }, data()],
        'malformed',
        /ds64 chunk at byte 36/,
      ],
      [
        'a data chunk that is not whole frames',
        [fmt({ channels: 2 }), { id: 'data', body: new Uint8Array(962) }],
        'malformed',
        /962 bytes, not a whole number of 4-byte frames/,
      ],
    ] as const)('%s', (_name, chunks, code, message) => {
      expectRefused(riffFile({ chunks: chunks as unknown as ChunkSpec[] }), code, message);
    });

    it('a chunk id that is not text (a wrong size before it)', () => {
      const file = riffFile({
        chunks: [fmt(), { id: 'JUNK', body: new Uint8Array(8), declaredSize: 5 }, data()],
      });
      expectRefused(file, 'malformed', /chunk at byte 50 has no valid id/);
    });

    it(`more than ${MAX_WAVE_CHUNKS} chunks`, () => {
      const empties = Array.from({ length: MAX_WAVE_CHUNKS + 1 }, () => ({
        id: 'JUNK',
        body: new Uint8Array(0),
      }));
      expectRefused(riffFile({ chunks: [fmt(), ...empties, data()] }), 'malformed', /more than 1024 chunks/);
    });

    it('stray bytes at the end of the form', () => {
      const file = riffFile({ chunks: [fmt(), data()], trailing: Uint8Array.from([1, 2, 3]) });
      new DataView(file.buffer).setUint32(4, file.length - 8, true);
      expectRefused(file, 'malformed', /3 stray byte\(s\)/);
    });

    it('a RIFF size beyond the end of the file', () =>
      expectRefused(
        riffFile({ chunks: [fmt(), data()], riffSize: 1 << 24 }),
        'truncated',
        /declares 16777224 bytes but the file has 1004/,
      ));

    it('a header cut short, and a RIFF file of another form', () => {
      expectRefused(
        Uint8Array.from('RIFF\x04\x00', (c) => c.charCodeAt(0)),
        'truncated',
        /6 bytes is shorter than a RIFF header/,
      );
      const avi = riffFile({ chunks: [fmt(), data()] });
      avi.set(
        Uint8Array.from('AVI ', (c) => c.charCodeAt(0)),
        8,
      );
      expectRefused(avi, 'notWav', /not a WAV file/);
    });

    it('an RF64 file without a ds64 chunk, and a ds64 table longer than its chunk', () => {
      expectRefused(
        riffFile({ container: 'RF64', chunks: [fmt(), data()] }),
        'malformed',
        /must begin with a ds64 chunk/,
      );
      const ds64 = words(0, 0, 0, 0, 0, 0, 0xffffffff);
      expectRefused(
        riffFile({ container: 'RF64', chunks: [{ id: 'ds64', body: ds64 }, fmt(), data()] }),
        'malformed',
        /4294967295 table entries, but its 28 bytes hold at most 0/,
      );
    });

    it('an RF64 chunk that defers its size to a ds64 table lacking it', () => {
      const ds64 = words(2000, 0, 960, 0, 480, 0, 0);
      const file = riffFile({
        container: 'RF64',
        chunks: [
          { id: 'ds64', body: ds64 },
          fmt(),
          { id: 'JUNK', body: new Uint8Array(2), declaredSize: 0xffffffff },
          data(),
        ],
      });
      expectRefused(file, 'malformed', /'JUNK' chunk .* defers its size to the ds64 chunk/);
    });
  });

  describe('refuses formats it cannot decode, naming the field', () => {
    it('zero channels', () =>
      expectRefused(
        riffFile({ chunks: [fmt({ channels: 0, blockAlign: 2 }), data()] }),
        'malformed',
        /declares 0 channels/,
      ));

    it.each([0, 1, 8000, 22050, 384000, 0xffffffff])('a sample rate of %i Hz', (rate) =>
      expectRefused(
        riffFile({ chunks: [fmt({ sampleRateHz: rate }), data()] }),
        'unsupportedSampleRate',
        new RegExp(`the file has ${rate} Hz`),
      ),
    );

    it.each([
      [1, 8],
      [1, 12],
      [1, 20],
      [1, 0],
      [3, 16],
      [3, 64],
      [2, 16],
      [0x55, 16],
    ])('format code %i with %i bits per sample', (formatCode, bitsPerSample) =>
      expectRefused(
        riffFile({ chunks: [fmt({ formatCode, bitsPerSample, blockAlign: 2 }), data()] }),
        'unsupportedEncoding',
        new RegExp(`format code ${formatCode}, ${bitsPerSample} bits`),
      ),
    );

    it('an extensible sub-format that is not a standard GUID, and more valid bits than the container', () => {
      const odd = fmtBody({ extensibleSubformat: 1 });
      odd[39] ^= 0xff;
      expectRefused(
        riffFile({ chunks: [{ id: 'fmt ', body: odd }, data()] }),
        'unsupportedEncoding',
        /not a standard PCM or float GUID/,
      );
      expectRefused(
        riffFile({ chunks: [fmt({ extensibleSubformat: 1, validBitsPerSample: 24 }), data()] }),
        'malformed',
        /24 valid bits cannot fit a 16-bit sample container/,
      );
    });

    it('a block size that contradicts channels and bits', () =>
      expectRefused(
        riffFile({ chunks: [fmt({ channels: 2, blockAlign: 2 }), data()] }),
        'malformed',
        /2 channel\(s\) of 16 bits cannot have a block size of 2 bytes/,
      ));
  });

  describe('float samples', () => {
    const floatFile = (samples: number[]) =>
      riffFile({
        chunks: [fmt({ formatCode: 3, bitsPerSample: 32 }), { id: 'data', body: float32Body(samples) }],
      });

    it.each([
      [3e38, /is 3\.000e\+38 \(769\.5 dBFS\); float samples may reach at most ±1000/],
      [-3e38, /is -3\.000e\+38 \(769\.5 dBFS\)/],
      [1001, /is 1001 \(60\.0 dBFS\)/],
      [Number.NaN, /not a finite number \(NaN\)/],
      [Number.POSITIVE_INFINITY, /not a finite number \(Infinity\)/],
      [Number.NEGATIVE_INFINITY, /not a finite number \(-Infinity\)/],
    ])('refuses %p', (value, message) =>
      expectRefused(floatFile([0, 0.1, value, 0]), 'invalidSamples', message),
    );

    it('keeps samples above full scale unclipped, with a warning saying how far above', () => {
      const decoded = decodeWav(floatFile([0, 2, -0.5, 0]));
      expect(Array.from(decoded.samples)).toEqual([0, 2, -0.5, 0]);
      expect(decoded.warnings).toEqual([expect.objectContaining({ code: 'aboveFullScale' })]);
      // 20·log10(2) = 6.02 dB.
      expect(decoded.warnings[0].message).toMatch(/reach 6\.0 dBFS/);
      expect(decodeWav(floatFile([0, 1, -1, 0])).warnings).toEqual([]);
    });
  });
});
