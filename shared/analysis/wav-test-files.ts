/**
 * Hand-built RIFF/WAVE files for the decoder's tests, byte by byte, so that every field can be wrong on
 * purpose (no binary fixtures). Not used by the service.
 */

export interface ChunkSpec {
  id: string;
  body: Uint8Array;
  /** Size written in the header instead of the body's length. */
  declaredSize?: number;
  /** Leave out the pad byte after an odd-sized body. */
  noPad?: boolean;
}

export interface RiffSpec {
  container?: 'RIFF' | 'RIFX' | 'RF64' | 'BW64';
  chunks: ChunkSpec[];
  /** RIFF size written in the header instead of the true one. */
  riffSize?: number;
  /** Bytes appended after the form. */
  trailing?: Uint8Array;
}

export function riffFile(spec: RiffSpec): Uint8Array {
  const littleEndian = spec.container !== 'RIFX';
  const parts: Uint8Array[] = [];
  for (const chunk of spec.chunks) {
    const header = new Uint8Array(8);
    header.set(ascii(chunk.id), 0);
    new DataView(header.buffer).setUint32(4, chunk.declaredSize ?? chunk.body.length, littleEndian);
    parts.push(header, chunk.body);
    if (chunk.body.length % 2 === 1 && !chunk.noPad) parts.push(new Uint8Array(1));
  }
  const formBytes = 4 + parts.reduce((n, p) => n + p.length, 0);
  const head = new Uint8Array(12);
  head.set(ascii(spec.container ?? 'RIFF'), 0);
  new DataView(head.buffer).setUint32(4, spec.riffSize ?? formBytes, littleEndian);
  head.set(ascii('WAVE'), 8);
  return concat([head, ...parts, spec.trailing ?? new Uint8Array(0)]);
}

export interface FmtSpec {
  formatCode?: number;
  channels?: number;
  sampleRateHz?: number;
  bitsPerSample?: number;
  blockAlign?: number;
  /** WAVE_FORMAT_EXTENSIBLE with this sub-format code (1 PCM, 3 float). */
  extensibleSubformat?: number;
  validBitsPerSample?: number;
  littleEndian?: boolean;
}

/** The body of a `fmt ` chunk (16 bytes, or 40 for WAVE_FORMAT_EXTENSIBLE). */
export function fmtBody(spec: FmtSpec = {}): Uint8Array {
  const channels = spec.channels ?? 1;
  const rate = spec.sampleRateHz ?? 48000;
  const bits = spec.bitsPerSample ?? 16;
  const blockAlign = spec.blockAlign ?? (channels * bits) / 8;
  const le = spec.littleEndian ?? true;
  const extensible = spec.extensibleSubformat !== undefined;
  const body = new Uint8Array(extensible ? 40 : 16);
  const view = new DataView(body.buffer);
  view.setUint16(0, extensible ? 0xfffe : (spec.formatCode ?? 1), le);
  view.setUint16(2, channels, le);
  view.setUint32(4, rate, le);
  view.setUint32(8, (rate * blockAlign) >>> 0, le);
  view.setUint16(12, blockAlign & 0xffff, le);
  view.setUint16(14, bits, le);
  if (extensible) {
    view.setUint16(16, 22, le);
    view.setUint16(18, spec.validBitsPerSample ?? bits, le);
    view.setUint32(20, 0, le);
    view.setUint32(24, spec.extensibleSubformat ?? 1, le);
    view.setUint16(28, 0, le);
    view.setUint16(30, 0x0010, le);
    body.set([0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71], 32);
  }
  return body;
}

/** 16-bit PCM sample bytes of ±1 full-scale samples (interleaved when several channels are given). */
export function pcm16Body(channels: ArrayLike<number>[], littleEndian = true): Uint8Array {
  const frames = channels[0].length;
  const body = new Uint8Array(frames * channels.length * 2);
  const view = new DataView(body.buffer);
  for (let i = 0; i < frames; i++) {
    channels.forEach((c, k) => {
      const v = Math.max(-32768, Math.min(32767, Math.round(c[i] * 32768)));
      view.setInt16((i * channels.length + k) * 2, v, littleEndian);
    });
  }
  return body;
}

/** 32-bit float sample bytes, mono. */
export function float32Body(samples: ArrayLike<number>): Uint8Array {
  const body = new Uint8Array(samples.length * 4);
  const view = new DataView(body.buffer);
  for (let i = 0; i < samples.length; i++) view.setFloat32(i * 4, samples[i], true);
  return body;
}

/** A body of 32-bit little-endian words. */
export function words(...values: number[]): Uint8Array {
  const body = new Uint8Array(values.length * 4);
  values.forEach((v, i) => new DataView(body.buffer).setUint32(i * 4, v >>> 0, true));
  return body;
}

/** An impulse of `amplitude` at sample `at` in `length` samples. */
export function impulseSamples(length: number, at: number, amplitude = 0.5): Float64Array {
  const x = new Float64Array(length);
  x[at] = amplitude;
  return x;
}

/**
 * The file of the reported attack: 9,656 bytes, a valid 16-bit 48 kHz mono impulse response preceded by a
 * `cue ` chunk whose 28-byte body declares 0xFFFFFFFF cue points.
 */
export function cueBombFile(): Uint8Array {
  const cue = concat([words(0xffffffff), new Uint8Array(24)]);
  const frames = (9656 - 12 - 24 - (8 + cue.length) - 8) / 2;
  return riffFile({
    chunks: [
      { id: 'fmt ', body: fmtBody() },
      { id: 'cue ', body: cue },
      { id: 'data', body: pcm16Body([impulseSamples(frames, 100)]) },
    ],
  });
}

/** A `smpl` chunk of the minimum 36 bytes that declares `loops` sample loops. */
export function smplBody(loops: number, samplerData = 0, actualLoops = 0, actualSamplerData = 0): Uint8Array {
  return concat([
    words(0, 0, 20833, 60, 0, 0, 0, loops, samplerData),
    new Uint8Array(24 * actualLoops + actualSamplerData),
  ]);
}

export function ascii(text: string): Uint8Array {
  return Uint8Array.from(text, (c) => c.charCodeAt(0));
}

export function concat(parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let offset = 0;
  for (const p of parts) {
    out.set(p, offset);
    offset += p.length;
  }
  return out;
}
