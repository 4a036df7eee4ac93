/**
 * A recording as a WAV file: IEEE float 32-bit, little-endian, channels interleaved (Microsoft/IBM
 * Multimedia Programming Interface and Data Specifications 1.0, 1991: RIFF, `fmt ` format 3, `data`).
 * Float keeps the recording exactly as the browser delivered it, with no rounding or clipping.
 */
export function encodeFloatWav(channels: readonly Float32Array[], sampleRateHz: number): Blob {
  const channelCount = channels.length;
  const frames = channelCount ? Math.min(...channels.map((c) => c.length)) : 0;
  const dataBytes = frames * channelCount * 4;
  const buffer = new ArrayBuffer(44 + dataBytes);
  const view = new DataView(buffer);
  const text = (offset: number, value: string) => {
    for (let i = 0; i < value.length; i++) view.setUint8(offset + i, value.charCodeAt(i));
  };
  text(0, 'RIFF');
  view.setUint32(4, 36 + dataBytes, true);
  text(8, 'WAVE');
  text(12, 'fmt ');
  view.setUint32(16, 16, true);
  view.setUint16(20, 3, true); // WAVE_FORMAT_IEEE_FLOAT
  view.setUint16(22, channelCount, true);
  view.setUint32(24, sampleRateHz, true);
  view.setUint32(28, sampleRateHz * channelCount * 4, true);
  view.setUint16(32, channelCount * 4, true);
  view.setUint16(34, 32, true);
  text(36, 'data');
  view.setUint32(40, dataBytes, true);
  let offset = 44;
  for (let i = 0; i < frames; i++)
    for (let c = 0; c < channelCount; c++) {
      view.setFloat32(offset, channels[c][i], true);
      offset += 4;
    }
  return new Blob([buffer], { type: 'audio/wav' });
}

/** Peak level of a block in dBFS (±1.0 is 0 dBFS); −∞ for silence, shown as the meter's floor. */
export function peakDbfs(samples: ArrayLike<number>): number {
  let peak = 0;
  for (let i = 0; i < samples.length; i++) peak = Math.max(peak, Math.abs(samples[i]));
  return peak > 0 ? 20 * Math.log10(peak) : Number.NEGATIVE_INFINITY;
}

/** Joins recorded blocks of one channel into one array. */
export function joinBlocks(blocks: readonly Float32Array[]): Float32Array {
  const out = new Float32Array(blocks.reduce((n, b) => n + b.length, 0));
  let offset = 0;
  for (const block of blocks) {
    out.set(block, offset);
    offset += block.length;
  }
  return out;
}
