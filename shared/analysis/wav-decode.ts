import { readWaveLayout, type WaveContainer } from './riff-wave';
import { SignalProblemError } from './signal-problem';

export type WavEncoding = 'pcm16' | 'pcm24' | 'pcm32' | 'float32';

export interface WavDecodeLimits {
  /** Longest accepted file, in seconds. */
  maxDurationS: number;
  minSampleRateHz: number;
  maxSampleRateHz: number;
}

/** Accepted range of the impulse-response uploads (documented in the OpenAPI description). */
export const DEFAULT_WAV_LIMITS: WavDecodeLimits = {
  maxDurationS: 30,
  minSampleRateHz: 44100,
  maxSampleRateHz: 192000,
};

/**
 * Largest magnitude accepted from a float file: 1000 × full scale (+60 dBFS). Float files may carry
 * headroom above full scale, so values above 1 only warn; far beyond that they are corrupt or not audio.
 */
export const MAX_FLOAT_SAMPLE = 1000;

export interface DecodeWarning {
  code: string;
  message: string;
}

export interface WavInfo {
  container: WaveContainer;
  sampleRateHz: number;
  channelCount: number;
  encoding: WavEncoding;
  frameCount: number;
  durationS: number;
}

export interface DecodedWav extends WavInfo {
  /** Zero-based index of the channel returned in `samples`. */
  channelIndex: number;
  /** The chosen channel, full scale = ±1. */
  samples: Float64Array;
  warnings: DecodeWarning[];
}

export interface OpenedWav extends WavInfo {
  /**
   * Decodes one channel to ±1 full scale.
   * @param index zero-based channel.
   * @param field the request field that named it, for errors.
   */
  channel(
    index: number | undefined,
    field: string,
  ): { channelIndex: number; samples: Float64Array; warnings: DecodeWarning[] };
}

const WAVE_FORMAT_PCM = 1;
const WAVE_FORMAT_IEEE_FLOAT = 3;

/**
 * Reads a WAV file's header and checks it against the limits, without decoding samples yet.
 * Container: RIFF, RIFX, RF64 or BW64, walked chunk by chunk by {@link readWaveLayout}; encodings PCM 16,
 * 24 or 32-bit integer or 32-bit float, plain or WAVE_FORMAT_EXTENSIBLE.
 *
 * @param bytes the whole file.
 * @param limits duration and sample-rate limits (default {@link DEFAULT_WAV_LIMITS}).
 * @throws SignalProblemError naming what is wrong (empty, not a WAV file, truncated, malformed, unsupported
 *   encoding or sample rate, too long).
 */
export function openWav(bytes: Uint8Array, limits: WavDecodeLimits = DEFAULT_WAV_LIMITS): OpenedWav {
  const layout = readWaveLayout(bytes);
  const { format, littleEndian, dataOffset, dataBytes, container } = layout;
  const encoding = encodingOf(format.formatCode, format.bitsPerSample);
  const { channelCount, sampleRateHz, blockAlign } = format;
  if (blockAlign !== channelCount * (format.bitsPerSample / 8)) {
    throw new SignalProblemError(
      `The file is malformed: ${channelCount} channel(s) of ${format.bitsPerSample} bits cannot have a block size of ${blockAlign} bytes.`,
      'malformed',
    );
  }
  if (sampleRateHz < limits.minSampleRateHz || sampleRateHz > limits.maxSampleRateHz) {
    throw new SignalProblemError(
      `The sample rate must be ${limits.minSampleRateHz}..${limits.maxSampleRateHz} Hz; the file has ${sampleRateHz} Hz.`,
      'unsupportedSampleRate',
    );
  }
  const frameCount = dataBytes / blockAlign;
  if (frameCount === 0)
    throw new SignalProblemError('The file holds no audio frames (empty data chunk).', 'emptyFile');
  const durationS = frameCount / sampleRateHz;
  if (durationS > limits.maxDurationS) {
    throw new SignalProblemError(
      `The file lasts ${durationS.toFixed(2)} s; files may last at most ${limits.maxDurationS} s.`,
      'tooLong',
    );
  }
  const data = bytes.subarray(dataOffset, dataOffset + dataBytes);
  return {
    container,
    sampleRateHz,
    channelCount,
    encoding,
    frameCount,
    durationS,
    channel(index, field) {
      const channelIndex = chooseChannel(index, channelCount, field);
      return {
        channelIndex,
        ...decodeChannel(data, encoding, channelCount, channelIndex, frameCount, littleEndian),
      };
    },
  };
}

/**
 * Decodes one channel of a WAV file (see {@link openWav}) to samples scaled to ±1 full scale.
 *
 * @param bytes the whole file.
 * @param options.channel zero-based channel index; required when the file has more than one channel.
 * @param options.limits duration and sample-rate limits (default {@link DEFAULT_WAV_LIMITS}).
 * @param options.channelField the request field that names the channel, for errors (default `/channel`).
 * @throws SignalProblemError naming what is wrong (as {@link openWav}, plus a channel missing or out of
 *   range, and float samples that are not finite or beyond ±{@link MAX_FLOAT_SAMPLE}).
 */
export function decodeWav(
  bytes: Uint8Array,
  options: { channel?: number; limits?: WavDecodeLimits; channelField?: string } = {},
): DecodedWav {
  const { channel, ...info } = openWav(bytes, options.limits);
  return { ...info, ...channel(options.channel, options.channelField ?? '/channel') };
}

function encodingOf(formatCode: number, bitsPerSample: number): WavEncoding {
  if (formatCode === WAVE_FORMAT_PCM && [16, 24, 32].includes(bitsPerSample)) {
    return `pcm${bitsPerSample}` as WavEncoding;
  }
  if (formatCode === WAVE_FORMAT_IEEE_FLOAT && bitsPerSample === 32) return 'float32';
  throw new SignalProblemError(
    `The encoding (format code ${formatCode}, ${bitsPerSample} bits) is not supported; use PCM 16, 24 or 32-bit integer or 32-bit float.`,
    'unsupportedEncoding',
  );
}

function chooseChannel(channel: number | undefined, channelCount: number, field: string): number {
  const name = field.replace(/^\//, '');
  if (channel === undefined) {
    if (channelCount === 1) return 0;
    throw new SignalProblemError(
      `The file has ${channelCount} channels; say which one to analyse with ${name} (0..${channelCount - 1}).`,
      'channelRequired',
      field,
    );
  }
  if (!Number.isInteger(channel) || channel < 0 || channel >= channelCount) {
    throw new SignalProblemError(
      `${name} must be an integer 0..${channelCount - 1} for this ${channelCount}-channel file; received ${channel}.`,
      'channelOutOfRange',
      field,
    );
  }
  return channel;
}

function decodeChannel(
  raw: Uint8Array,
  encoding: WavEncoding,
  channelCount: number,
  channelIndex: number,
  frameCount: number,
  littleEndian: boolean,
): { samples: Float64Array; warnings: DecodeWarning[] } {
  const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
  const bytesPerSample = encoding === 'pcm16' ? 2 : encoding === 'pcm24' ? 3 : 4;
  const stride = channelCount * bytesPerSample;
  const out = new Float64Array(frameCount);
  let offset = channelIndex * bytesPerSample;
  switch (encoding) {
    case 'pcm16':
      for (let i = 0; i < frameCount; i++, offset += stride)
        out[i] = view.getInt16(offset, littleEndian) / 32768;
      break;
    case 'pcm24':
      for (let i = 0; i < frameCount; i++, offset += stride) {
        const lo = littleEndian ? raw[offset] : raw[offset + 2];
        const hi = littleEndian ? raw[offset + 2] : raw[offset];
        out[i] = (((hi << 24) >> 8) | (raw[offset + 1] << 8) | lo) / 8388608;
      }
      break;
    case 'pcm32':
      for (let i = 0; i < frameCount; i++, offset += stride)
        out[i] = view.getInt32(offset, littleEndian) / 2147483648;
      break;
    case 'float32': {
      let peak = 0;
      for (let i = 0; i < frameCount; i++, offset += stride) {
        const value = view.getFloat32(offset, littleEndian);
        const magnitude = Math.abs(value);
        // NaN fails both comparisons, so it is caught with the infinities and the absurd values.
        if (!(magnitude <= MAX_FLOAT_SAMPLE)) {
          throw new SignalProblemError(
            Number.isFinite(value)
              ? `Sample ${i} of channel ${channelIndex} is ${value.toPrecision(4)} (${(20 * Math.log10(magnitude)).toFixed(1)} dBFS); float samples may reach at most ±${MAX_FLOAT_SAMPLE} (+60 dBFS).`
              : `Sample ${i} of channel ${channelIndex} is not a finite number (${value}).`,
            'invalidSamples',
          );
        }
        if (magnitude > peak) peak = magnitude;
        out[i] = value;
      }
      if (peak > 1) {
        return {
          samples: out,
          warnings: [
            {
              code: 'aboveFullScale',
              message: `Float samples of channel ${channelIndex} reach ${(20 * Math.log10(peak)).toFixed(1)} dBFS, above full scale (±1.0); levels are reported as they are, unclipped.`,
            },
          ],
        };
      }
      break;
    }
  }
  return { samples: out, warnings: [] };
}
