import { WaveFile } from 'wavefile';
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

export interface DecodedWav {
  sampleRateHz: number;
  channelCount: number;
  /** Zero-based index of the channel returned in `samples`. */
  channelIndex: number;
  encoding: WavEncoding;
  frameCount: number;
  durationS: number;
  /** The chosen channel, full scale = ±1. */
  samples: Float64Array;
}

const WAVE_FORMAT_PCM = 1;
const WAVE_FORMAT_IEEE_FLOAT = 3;
const WAVE_FORMAT_EXTENSIBLE = 0xfffe;
/** A data chunk size written by streaming recorders that did not know the length. */
const UNKNOWN_CHUNK_SIZE = 0xffffffff;

interface FmtChunk {
  audioFormat: number;
  numChannels: number;
  sampleRate: number;
  blockAlign: number;
  bitsPerSample: number;
  subformat: number[];
}

/**
 * Decodes one channel of a WAV file (RIFF or RIFX; PCM 16/24/32-bit integer or 32-bit float, plain or
 * WAVE_FORMAT_EXTENSIBLE) to samples scaled to ±1 full scale.
 *
 * The container and chunks are read with the `wavefile` package; the chosen channel is then decoded here
 * from the data bytes, which spares decoding the other channels and handles the extensible float
 * sub-format that `wavefile` reports as an integer bit depth.
 *
 * @param bytes the whole file.
 * @param options.channel zero-based channel index; required when the file has more than one channel.
 * @param options.limits duration and sample-rate limits (default {@link DEFAULT_WAV_LIMITS}).
 * @param options.channelField the request field that names the channel, for errors (default `/channel`).
 * @throws SignalProblemError naming what is wrong (empty, not a WAV file, truncated, unsupported encoding or
 *   sample rate, too long, channel missing or out of range).
 */
export function decodeWav(
  bytes: Uint8Array,
  options: { channel?: number; limits?: WavDecodeLimits; channelField?: string } = {},
): DecodedWav {
  const limits = options.limits ?? DEFAULT_WAV_LIMITS;
  if (bytes.length === 0) throw new SignalProblemError('The file is empty (0 bytes).', 'emptyFile');

  const wav = new WaveFile();
  try {
    wav.fromBuffer(bytes);
  } catch (error) {
    throw describeParseFailure(bytes, error);
  }
  const fmt = wav.fmt as FmtChunk;
  const data = wav.data as { chunkSize: number; samples: Uint8Array };
  const littleEndian = wav.container !== 'RIFX';

  const encoding = encodingOf(fmt);
  const { numChannels: channelCount, sampleRate: sampleRateHz, blockAlign } = fmt;
  if (channelCount < 1 || blockAlign !== channelCount * (fmt.bitsPerSample / 8)) {
    throw new SignalProblemError(
      `The format chunk is inconsistent: ${channelCount} channel(s) of ${fmt.bitsPerSample} bits cannot have a block size of ${blockAlign} bytes.`,
      'notWav',
    );
  }
  if (sampleRateHz < limits.minSampleRateHz || sampleRateHz > limits.maxSampleRateHz) {
    throw new SignalProblemError(
      `The sample rate must be ${limits.minSampleRateHz}..${limits.maxSampleRateHz} Hz; the file has ${sampleRateHz} Hz.`,
      'unsupportedSampleRate',
    );
  }

  const available = data.samples.length;
  if (data.chunkSize !== UNKNOWN_CHUNK_SIZE && available < data.chunkSize) {
    throw new SignalProblemError(
      `The file is truncated: its data chunk declares ${data.chunkSize} bytes but only ${available} are present.`,
      'truncated',
    );
  }
  const frameCount = Math.floor(available / blockAlign);
  if (frameCount === 0)
    throw new SignalProblemError('The file holds no audio frames (empty data chunk).', 'emptyFile');
  if (available % blockAlign !== 0 && data.chunkSize === UNKNOWN_CHUNK_SIZE) {
    throw new SignalProblemError(
      `The file is truncated: the data ends inside a frame (${available} bytes is not a multiple of the ${blockAlign}-byte frame).`,
      'truncated',
    );
  }
  const durationS = frameCount / sampleRateHz;
  if (durationS > limits.maxDurationS) {
    throw new SignalProblemError(
      `The file lasts ${durationS.toFixed(2)} s; impulse responses may last at most ${limits.maxDurationS} s.`,
      'tooLong',
    );
  }

  const channelIndex = chooseChannel(options.channel, channelCount, options.channelField ?? '/channel');
  const samples = decodeChannel(data.samples, encoding, channelCount, channelIndex, frameCount, littleEndian);
  return { sampleRateHz, channelCount, channelIndex, encoding, frameCount, durationS, samples };
}

function describeParseFailure(bytes: Uint8Array, error: unknown): SignalProblemError {
  const head = String.fromCharCode(...bytes.subarray(0, 4));
  const form = String.fromCharCode(...bytes.subarray(8, 12));
  const isRiff = ['RIFF', 'RIFX', 'RF64'].includes(head) && form === 'WAVE';
  if (!isRiff) {
    return new SignalProblemError('The file is not a WAV file (no RIFF/WAVE header).', 'notWav');
  }
  const reason = error instanceof Error ? error.message : String(error);
  if (/"data" chunk/.test(reason)) {
    return new SignalProblemError('The file is truncated or incomplete: it has no data chunk.', 'truncated');
  }
  if (/"fmt " chunk/.test(reason)) {
    return new SignalProblemError(
      'The file is truncated or incomplete: it has no format chunk.',
      'truncated',
    );
  }
  return new SignalProblemError(`The WAV file could not be read: ${reason}.`, 'notWav');
}

function encodingOf(fmt: FmtChunk): WavEncoding {
  // The first 32 bits of an extensible sub-format GUID carry the plain format code.
  const format = fmt.audioFormat === WAVE_FORMAT_EXTENSIBLE ? fmt.subformat[0] : fmt.audioFormat;
  if (format === WAVE_FORMAT_PCM && [16, 24, 32].includes(fmt.bitsPerSample)) {
    return `pcm${fmt.bitsPerSample}` as WavEncoding;
  }
  if (format === WAVE_FORMAT_IEEE_FLOAT && fmt.bitsPerSample === 32) return 'float32';
  throw new SignalProblemError(
    `The encoding (format code ${format}, ${fmt.bitsPerSample} bits) is not supported; use PCM 16, 24 or 32-bit integer or 32-bit float.`,
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
): Float64Array {
  const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
  const bytesPerSample = encoding === 'pcm16' ? 2 : encoding === 'pcm24' ? 3 : 4;
  const stride = channelCount * bytesPerSample;
  const out = new Float64Array(frameCount);
  let offset = channelIndex * bytesPerSample;
  for (let i = 0; i < frameCount; i++, offset += stride) {
    switch (encoding) {
      case 'pcm16':
        out[i] = view.getInt16(offset, littleEndian) / 32768;
        break;
      case 'pcm24': {
        const lo = littleEndian ? raw[offset] : raw[offset + 2];
        const hi = littleEndian ? raw[offset + 2] : raw[offset];
        out[i] = (((hi << 24) >> 8) | (raw[offset + 1] << 8) | lo) / 8388608;
        break;
      }
      case 'pcm32':
        out[i] = view.getInt32(offset, littleEndian) / 2147483648;
        break;
      case 'float32': {
        const value = view.getFloat32(offset, littleEndian);
        if (!Number.isFinite(value)) {
          throw new SignalProblemError(
            `Sample ${i} of channel ${channelIndex} is not a finite number.`,
            'invalidSamples',
          );
        }
        out[i] = value;
        break;
      }
    }
  }
  return out;
}
