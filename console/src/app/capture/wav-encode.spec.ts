import { readWaveLayout } from '../../../../shared/analysis/riff-wave';
import { encodeFloatWav, joinBlocks, peakDbfs } from './wav-encode';

describe('encodeFloatWav', () => {
  it('writes a float WAV the API’s own RIFF reader accepts, with the samples interleaved unchanged', async () => {
    const left = new Float32Array([0.5, -0.25, 1]);
    const right = new Float32Array([0, 0.125, -1]);
    const blob = encodeFloatWav([left, right], 44100);
    const bytes = new Uint8Array(await blob.arrayBuffer());
    const layout = readWaveLayout(bytes);
    expect(layout.format).toMatchObject({
      formatCode: 3,
      channelCount: 2,
      sampleRateHz: 44100,
      bitsPerSample: 32,
    });
    expect(layout.dataBytes).toBe(3 * 2 * 4);
    const view = new DataView(bytes.buffer, layout.dataOffset);
    const read = Array.from({ length: 6 }, (_, i) => view.getFloat32(i * 4, true));
    expect(read).toEqual([0.5, 0, -0.25, 0.125, 1, -1]);
  });
});

describe('peakDbfs', () => {
  it('reads a half-scale peak as −6.02 dBFS and silence as −∞', () => {
    expect(peakDbfs([0.1, -0.5, 0.2])).toBeCloseTo(20 * Math.log10(0.5), 6);
    expect(peakDbfs([0, 0])).toBe(Number.NEGATIVE_INFINITY);
  });
});

describe('joinBlocks', () => {
  it('keeps every sample in order', () => {
    expect(Array.from(joinBlocks([new Float32Array([1, 2]), new Float32Array([3])]))).toEqual([1, 2, 3]);
  });
});
