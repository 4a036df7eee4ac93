import { createIsochronClient } from './index';

/** Delays for three loudspeakers of the demo room Stage 3 (invented), then the biquad of one EQ band. */
export async function example(baseUrl: string, apiKey: string): Promise<string[]> {
  const isochron = createIsochronClient({ baseUrl, apiKey });

  const delays = await isochron.POST('/v1/delays', {
    body: {
      temperatureC: 21,
      sampleRateHz: 48000,
      channels: [
        { id: 'M+030', distance: 3.12 },
        { id: 'M+000', distance: '2.75 m' },
        { id: 'LFE1', arrivalMs: 10.6 },
      ],
    },
  });
  if (delays.error) throw new Error(`${delays.error.title}: ${delays.error.detail ?? ''}`);
  const lines = delays.data.channels.map(
    (c) => `${c.id}: ${c.delayMs.toFixed(3)} ms (${c.delaySamples} samples)`,
  );

  const eq = await isochron.POST('/v1/biquads', {
    body: { sampleRateHz: 48000, filters: [{ type: 'peaking', frequencyHz: 63, gainDb: -4.5, q: 4.3 }] },
  });
  if (eq.error) throw new Error(`${eq.error.title}: ${eq.error.detail ?? ''}`);
  const { b0, b1, b2, a1, a2 } = eq.data.sections[0];
  lines.push(`63 Hz cut: b = [${b0}, ${b1}, ${b2}], a = [1, ${a1}, ${a2}]`);
  return lines;
}
