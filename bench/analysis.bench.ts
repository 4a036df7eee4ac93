/**
 * Speed of the measurement analysis: impulse-response analysis and EQ fitting on synthetic data.
 * `npm run bench` calls {@link runAnalysisBench}; `npx tsx bench/analysis.bench.ts` runs it alone.
 */
import { WaveFile } from 'wavefile';
import { analyzeImpulseResponse } from '../shared/analysis/analyze-impulse-response';
import { noisyDecay } from '../shared/analysis/test-signals';
import { decodeWav } from '../shared/analysis/wav-decode';
import { fitParametricEq } from '../shared/eq-fit/fit-parametric-eq';
import { cookbookPeakingDb } from '../shared/filters/test-helpers';
import { measure, printResults, type BenchResult } from './measure';

/** A room-like 2 s impulse response at 48 kHz: direct sound, then a T60 = 0.5 s decay over −80 dB noise. */
function roomImpulseResponse(): Float64Array {
  const h = noisyDecay({
    sampleRateHz: 48000,
    durationS: 2,
    t60S: 0.5,
    startSample: 720,
    startRms: 0.05,
    noiseDb: -80,
    seed: 1,
  });
  h[700] = 0.7;
  return h;
}

/** 1/24-octave measurement 20–500 Hz with eight resonances and one floor-bounce null. */
function lowFrequencyMeasurement() {
  const steps = Math.round(Math.log2(500 / 20) * 24);
  const frequenciesHz = Array.from({ length: steps + 1 }, (_, k) => 20 * Math.pow(500 / 20, k / steps));
  const resonances: Array<[number, number, number]> = [
    [23, 7, 6],
    [28, 4, 5],
    [37, 5, 4],
    [46, 6, 6],
    [56, 8, 7],
    [140, 3, 2],
    [230, 4, 5],
    [380, 3, 4],
    [96, -14, 9],
  ];
  const magnitudeDb = frequenciesHz.map(
    (f) => 84 + resonances.reduce((db, [f0, g, q]) => db + cookbookPeakingDb(f0, g, q, f, 48000), 0),
  );
  return { frequenciesHz, magnitudeDb };
}

/**
 * 1/24-octave measurement 20 Hz–20 kHz: eight modes and a null below 300 Hz, a broad 3 kHz presence bump, a
 * second-order roll-off at 12 kHz and a −1 dB/octave tilt, as a full-range loudspeaker in a room might give.
 */
function fullRangeMeasurement() {
  const steps = Math.round(Math.log2(20000 / 20) * 24);
  const frequenciesHz = Array.from({ length: steps + 1 }, (_, k) => 20 * Math.pow(20000 / 20, k / steps));
  const shapes: Array<[number, number, number]> = [
    [23, 7, 6],
    [31, 4, 5],
    [41, 5, 4],
    [52, 6, 6],
    [66, 8, 7],
    [84, 5, 5],
    [130, 4, 4],
    [210, 4, 5],
    [110, -14, 9],
    [3000, 3, 0.8],
  ];
  const magnitudeDb = frequenciesHz.map(
    (f) =>
      84 +
      shapes.reduce((db, [f0, g, q]) => db + cookbookPeakingDb(f0, g, q, f, 48000), 0) -
      10 * Math.log10(1 + (f / 12000) ** 4) -
      Math.log2(f / 1000),
  );
  return { frequenciesHz, magnitudeDb };
}

export async function runAnalysisBench(options: { runs?: number } = {}): Promise<BenchResult[]> {
  const runs = options.runs ?? 21;
  const ir = roomImpulseResponse();
  const stage3 = { widthM: 6.1, lengthM: 7.4, heightM: 3.05 };
  const file = new WaveFile();
  file.fromScratch(
    1,
    48000,
    '24',
    Array.from(ir, (v) => Math.round(v * 8388607)),
  );
  const wavBytes = file.toBuffer();
  const measured = lowFrequencyMeasurement();
  const full = fullRangeMeasurement();
  return [
    measure('impulse-response analysis, 2 s at 48 kHz (with room modes)', 50, runs, () =>
      analyzeImpulseResponse(ir, 48000, { room: stage3 }),
    ),
    measure('WAV decode (24-bit mono, 2 s at 48 kHz) + analysis', null, runs, () => {
      const wav = decodeWav(wavBytes);
      analyzeImpulseResponse(wav.samples, wav.sampleRateHz);
    }),
    measure('8-band EQ fit, 1/24-octave data 20–500 Hz, cuts only', 250, runs, () =>
      fitParametricEq({ sampleRateHz: 48000, measured, maxBands: 8, fromHz: 20, toHz: 500 }),
    ),
    measure('8-band EQ fit, 1/24-octave data 20–500 Hz, boosts up to 6 dB', 250, runs, () =>
      fitParametricEq({ sampleRateHz: 48000, measured, maxBands: 8, maxBoostDb: 6, fromHz: 20, toHz: 500 }),
    ),
    measure(
      'EQ fit, 1/24-octave data 20 Hz–20 kHz, defaults (up to 8 bands below the 100.8 Hz transition)',
      100,
      runs,
      () =>
        fitParametricEq({
          sampleRateHz: 48000,
          measured: full,
          maxBands: 8,
          room: { volumeM3: 137.7, reverberationTimeS: 0.35 },
        }),
    ),
    measure(
      '8-band EQ fit, 1/24-octave data 20 Hz–20 kHz, up to 300 Hz + 2 broad bands above, boosts up to 3 dB',
      100,
      runs,
      () =>
        fitParametricEq({
          sampleRateHz: 48000,
          measured: full,
          maxBands: 8,
          maxBoostDb: 3,
          toHz: 300,
          aboveTransition: {},
        }),
    ),
    measure('8-band EQ fit, 1/24-octave data 20 Hz–20 kHz, three positions, up to 300 Hz', 100, runs, () =>
      fitParametricEq({
        sampleRateHz: 48000,
        positions: [0, 1.5, -1.5].map((shift, k) => ({
          label: `mic ${k + 1}`,
          measured: {
            frequenciesHz: full.frequenciesHz,
            magnitudeDb: full.magnitudeDb.map((db, i) => db + shift * Math.sin(i / 9)),
          },
        })),
        maxBands: 8,
        toHz: 300,
      }),
    ),
  ];
}

export default runAnalysisBench;

if (require.main === module) {
  void runAnalysisBench().then((results) => {
    printResults(results);
    if (results.some((r) => r.passed === false)) process.exitCode = 1;
  });
}
