import { encode } from 'node-wav';
import type { SampleEncoding } from '../../shared/capture/test-signal';

/**
 * A WAV file of the channels (full scale ±1), written with node-wav: a canonical 44-byte RIFF header and
 * interleaved samples (PCM 16 or 24-bit, or 32-bit IEEE float). node-wav was chosen over wavefile, already
 * a dependency, because wavefile took about 10 s to write a 32 MiB twelve-channel file here, holding the
 * event loop; node-wav writes it in well under a tenth of that.
 */
export function wavFile(channels: Float64Array[], sampleRateHz: number, encoding: SampleEncoding): Buffer {
  if (encoding === 'float32') return encode(channels, { sampleRate: sampleRateHz, float: true });
  return encode(channels, { sampleRate: sampleRateHz, bitDepth: encoding === 'pcm16' ? 16 : 24 });
}
