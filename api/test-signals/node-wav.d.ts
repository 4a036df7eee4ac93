/** The part of node-wav (MIT, no bundled types) that Isochron uses. */
declare module 'node-wav' {
  interface EncodeOptions {
    sampleRate: number;
    bitDepth?: 16 | 24 | 32;
    float?: boolean;
  }
  /** Interleaves the channels into a canonical RIFF/WAVE file (44-byte header), clipping at ±1. */
  export function encode(channelData: ArrayLike<number>[], options: EncodeOptions): Buffer;
}
