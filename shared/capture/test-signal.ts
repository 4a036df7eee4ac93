import { CalculationInputError } from '../errors';
import { LIMITS } from '../limits';
import type { Caution } from '../notices';
import { pinkNoise, SINE_CREST_DB, type PinkNoiseBand } from './pink-noise';
import { exponentialSweep, harmonicAdvanceS, sweepLength, sweepRateS, type SweepSpec } from './sweep';

export type TestSignalKind = 'sweep' | 'pinkNoise' | 'sweepSequence';
export type SampleEncoding = 'pcm16' | 'pcm24' | 'float32';

/** Largest test-signal file, bytes (64 MiB). */
export const MAX_TEST_SIGNAL_BYTES = 64 * 1024 * 1024;
/** Default levels: sweeps −12 dBFS sine peak, noise −20 dBFS RMS (the common reference of level calibration). */
export const DEFAULT_SWEEP_LEVEL_DBFS = LIMITS['SweepRecordingUpload.levelDbfs'].default;
export const DEFAULT_NOISE_LEVEL_DBFS = -20;
/** A canonical WAV header (RIFF, fmt, data) in bytes. */
const WAV_HEADER_BYTES = 44;

export interface TestSignalRequest {
  kind: TestSignalKind;
  sampleRateHz: number;
  encoding: SampleEncoding;
  durationS: number;
  levelDbfs?: number;
  startHz?: number;
  endHz?: number;
  fadeInS?: number;
  fadeOutS?: number;
  silenceAfterS?: number;
  band?: PinkNoiseBand;
  seed?: number;
  channels?: string[];
  gapS?: number;
  timingReference?: boolean;
}

/**
 * Defaults of the kind-specific fields (the contract leaves them unset so a field of another kind shows).
 * The sweep's are the contract's defaults for a stored sweep recording, which describe the same sweep.
 */
export const TEST_SIGNAL_DEFAULTS = {
  startHz: LIMITS['SweepRecordingUpload.startHz'].default,
  endHz: LIMITS['SweepRecordingUpload.endHz'].default,
  fadeInS: LIMITS['SweepRecordingUpload.fadeInS'].default,
  fadeOutS: LIMITS['SweepRecordingUpload.fadeOutS'].default,
  silenceAfterS: 2,
  band: 'full' as PinkNoiseBand,
  seed: 1,
  gapS: 3,
  timingReference: false,
};

export interface SweepDescription extends Omit<SweepSpec, 'sampleRateHz'> {
  /** L = T/ln(f2/f1), seconds. */
  rateS: number;
  formula: string;
  /** Where each harmonic's response lands before the linear one after deconvolution, seconds. */
  harmonicAdvanceS: Array<{ harmonic: number; advanceS: number }>;
}

export interface TestSignal {
  kind: TestSignalKind;
  sampleRateHz: number;
  encoding: SampleEncoding;
  channelCount: number;
  frameCount: number;
  durationS: number;
  sizeBytes: number;
  peakDbfs: number;
  sweep?: SweepDescription;
  pinkNoise?: {
    band: PinkNoiseBand;
    fromHz: number;
    toHz: number;
    rmsDbfs: number;
    rmsDbfsSineReferenced: number;
    peakDbfs: number;
    crestFactorDb: number;
    seed: number;
  };
  sequence?: {
    gapS: number;
    periodS: number;
    slots: Array<{ channel: string; channelIndex: number; startS: number; startSample: number }>;
    timingReferenceChannelIndex: number | null;
  };
  cautions: Caution[];
}

const bytesPerSample = (encoding: SampleEncoding): number =>
  encoding === 'pcm16' ? 2 : encoding === 'pcm24' ? 3 : 4;

/** Fields that belong to one kind only; giving them with another kind is refused rather than ignored. */
const KIND_FIELDS: Record<string, TestSignalKind[]> = {
  band: ['pinkNoise'],
  seed: ['pinkNoise'],
  startHz: ['sweep', 'sweepSequence'],
  endHz: ['sweep', 'sweepSequence'],
  fadeInS: ['sweep', 'sweepSequence'],
  fadeOutS: ['sweep', 'sweepSequence'],
  silenceAfterS: ['sweep'],
  channels: ['sweepSequence'],
  gapS: ['sweepSequence'],
  timingReference: ['sweepSequence'],
};

/** Fields the caller gave that do not apply to the request's kind, for the API to refuse. */
export function fieldsForOtherKinds(request: TestSignalRequest): string[] {
  return Object.entries(request)
    .filter(
      ([name, value]) =>
        value !== undefined && KIND_FIELDS[name] && !KIND_FIELDS[name].includes(request.kind),
    )
    .map(([name]) => name);
}

/**
 * Builds a test signal: its channels (full scale ±1) and what it is. The file size is checked before any
 * sample is made.
 * @throws CalculationInputError naming the field (a band edge above Nyquist, a file over 64 MiB, clipping).
 */
export function makeTestSignal(given: TestSignalRequest): { channels: Float64Array[]; signal: TestSignal } {
  const request = { ...TEST_SIGNAL_DEFAULTS, ...withoutUndefined(given) };
  const fs = request.sampleRateHz;
  const sweepSpec: SweepSpec = {
    sampleRateHz: fs,
    startHz: request.startHz,
    endHz: request.endHz,
    durationS: request.durationS,
    fadeInS: request.fadeInS,
    fadeOutS: request.fadeOutS,
    levelDbfs: request.levelDbfs ?? DEFAULT_SWEEP_LEVEL_DBFS,
    silenceAfterS: request.kind === 'sweep' ? request.silenceAfterS : 0,
  };
  const labels = request.kind === 'sweepSequence' ? requireChannels(request.channels) : [];
  const channelCount =
    request.kind === 'sweepSequence' ? labels.length + (request.timingReference ? 1 : 0) : 1;
  const gap = Math.round(request.gapS * fs);
  const period = sweepLength(sweepSpec) + gap;
  const frameCount =
    request.kind === 'sweepSequence'
      ? labels.length * period
      : request.kind === 'sweep'
        ? sweepLength(sweepSpec) + Math.round(sweepSpec.silenceAfterS * fs)
        : Math.round(request.durationS * fs);
  const sizeBytes = WAV_HEADER_BYTES + frameCount * channelCount * bytesPerSample(request.encoding);
  if (sizeBytes > MAX_TEST_SIGNAL_BYTES) {
    throw new CalculationInputError(
      `the file would be ${(sizeBytes / 1048576).toFixed(1)} MiB (${channelCount} channel(s) × ${(frameCount / fs).toFixed(2)} s × ${bytesPerSample(request.encoding)} bytes at ${fs} Hz); at most 64 MiB: shorten durationS${request.kind === 'sweepSequence' ? ' or gapS, or use fewer channels' : ''}, or lower the sample rate or the encoding`,
      '/durationS',
    );
  }
  const base = {
    kind: request.kind,
    sampleRateHz: fs,
    encoding: request.encoding,
    channelCount,
    frameCount,
    durationS: frameCount / fs,
    sizeBytes,
  };

  if (request.kind === 'pinkNoise') {
    const noise = pinkNoise({
      sampleRateHz: fs,
      durationS: request.durationS,
      band: request.band,
      rmsDbfs: request.levelDbfs ?? DEFAULT_NOISE_LEVEL_DBFS,
      seed: request.seed,
    });
    const { samples, ...levels } = noise;
    return {
      channels: [samples],
      signal: {
        ...base,
        peakDbfs: noise.peakDbfs,
        pinkNoise: { band: request.band, ...levels, seed: request.seed },
        cautions: testSignalCautions(request.kind, noise.peakDbfs, noise.rmsDbfs),
      },
    };
  }

  const sweep = exponentialSweep(sweepSpec);
  const description = describeSweep(sweepSpec);
  const sweepRms = sweepSpec.levelDbfs - SINE_CREST_DB;
  if (request.kind === 'sweep') {
    return {
      channels: [sweep],
      signal: {
        ...base,
        peakDbfs: sweepSpec.levelDbfs,
        sweep: description,
        cautions: testSignalCautions(request.kind, sweepSpec.levelDbfs, sweepRms),
      },
    };
  }
  const channels = Array.from({ length: channelCount }, () => new Float64Array(frameCount));
  const slots = labels.map((channel, index) => {
    channels[index].set(sweep, index * period);
    if (request.timingReference) channels[labels.length].set(sweep, index * period);
    return { channel, channelIndex: index, startS: (index * period) / fs, startSample: index * period };
  });
  return {
    channels,
    signal: {
      ...base,
      peakDbfs: sweepSpec.levelDbfs,
      sweep: description,
      sequence: {
        gapS: gap / fs,
        periodS: period / fs,
        slots,
        timingReferenceChannelIndex: request.timingReference ? labels.length : null,
      },
      cautions: testSignalCautions(request.kind, sweepSpec.levelDbfs, sweepRms),
    },
  };
}

function withoutUndefined<T extends object>(value: T): T {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as T;
}

function requireChannels(channels: string[] | undefined): string[] {
  if (!channels || channels.length === 0) {
    throw new CalculationInputError('a sweep sequence needs the channels to sweep, in order', '/channels');
  }
  const seen = new Set<string>();
  channels.forEach((label, i) => {
    if (seen.has(label))
      throw new CalculationInputError(`channel ${label} is listed twice`, `/channels/${i}`);
    seen.add(label);
  });
  return channels;
}

function describeSweep(spec: SweepSpec): SweepDescription {
  const { sampleRateHz: _fs, ...rest } = spec;
  return {
    ...rest,
    rateS: sweepRateS(spec),
    formula:
      'x(t) = A·sin(2π·f1·L·(e^(t/L) − 1)), L = T/ln(f2/f1), A = 10^(levelDbfs/20) (Farina, AES 108th Convention, 2000)',
    harmonicAdvanceS: [2, 3, 4, 5].map((harmonic) => ({
      harmonic,
      advanceS: harmonicAdvanceS(spec, harmonic),
    })),
  };
}

/** NIOSH recommended exposure limit: 85 dBA over 8 hours, 3 dB exchange rate (NIOSH 98-126, 1998). */
const NIOSH_REL_DBA = 85;

/** The caution every test signal carries, with this signal's own levels. */
export function testSignalCautions(kind: TestSignalKind, peakDbfs: number, rmsDbfs: number): Caution[] {
  const what = kind === 'pinkNoise' ? 'This noise' : 'This sweep';
  return [
    {
      code: 'testSignalLevel',
      message:
        `${what} peaks at ${peakDbfs.toFixed(1)} dBFS with an RMS of ${rmsDbfs.toFixed(1)} dBFS. Before playing it, turn the ` +
        'monitoring system down, start quietly and raise the level gradually while watching a meter. Protect hearing: ' +
        `NIOSH recommends at most ${NIOSH_REL_DBA} dBA over 8 hours, halving the time for every 3 dB more; wear hearing ` +
        'protection or leave the room during loud measurements.',
    },
    {
      code: 'driverProtection',
      message:
        kind === 'pinkNoise'
          ? 'Protect drivers: broadband noise at high level heats tweeter voice coils; send low-band noise only to subwoofers and full-range channels, never to a tweeter feed, and stop at any distortion or protection light.'
          : 'Protect drivers: a sweep puts its full level on every frequency in turn, so tweeters see the peak level at high frequencies and woofers large excursions at low ones; keep a sweep that starts low away from a tweeter feed and stop at any distortion or protection light.',
    },
  ];
}
