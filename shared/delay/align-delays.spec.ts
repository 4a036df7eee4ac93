import fc from 'fast-check';
import { catchInputError, expectWithin } from '../filters/test-helpers';
import { MAX_CHANNELS } from '../limits';
import { alignDelays, DelayInput } from './align-delays';

/** 343.2·sqrt((t + 273.15)/293.15) m/s (pyfar, ISO 9613-1 form), written out here for expected values. */
const C20 = 343.2;

describe('alignDelays', () => {
  // Trade rule of thumb (common practice): one loudspeaker 0.5 ms late while the others are
  // aligned → it becomes the reference with 0 and every other one gets +0.5 ms.
  it('gives +0.5 ms to every channel when one arrives 0.5 ms late', () => {
    const plan = alignDelays({
      channels: [
        { id: 'M+030', arrivalMs: 8.75 },
        { id: 'M-030', arrivalMs: 8.75 },
        { id: 'M+000', arrivalMs: 9.25 },
        { id: 'M+110', arrivalMs: 8.75 },
      ],
    });
    expect(plan.referenceChannel).toBe('M+000');
    const delays = Object.fromEntries(plan.channels.map((c) => [c.id, c.delayMs]));
    expectWithin(delays['M+000'], 0, 0, 'reference');
    for (const label of ['M+030', 'M-030', 'M+110']) expectWithin(delays[label], 0.5, 1e-12, label);
    // 0.5 ms at 48 kHz is exactly 24 samples.
    expect(plan.channels.map((c) => c.delaySamples)).toEqual([24, 24, 0, 24]);
    expect(
      plan.channels.every((c) => c.quantizationErrorUs === 0 || Math.abs(c.quantizationErrorUs) < 1e-9),
    ).toBe(true);
  });

  it('computes delays from distances at the air temperature, in ms and rounded samples', () => {
    const plan = alignDelays({
      channels: [
        { id: 'M+030', distance: 3.0 },
        { id: 'M+000', distance: 2.5 },
        { id: 'M+110', distance: '7.5 ft' },
      ],
      temperatureC: 20,
    });
    expectWithin(plan.speedOfSoundMps, C20, 1e-9, 'c');
    expect(plan.referenceChannel).toBe('M+030');
    const centre = plan.channels[1];
    const expectedMs = ((3.0 - 2.5) / C20) * 1000; // 1.45688 ms
    expectWithin(centre.delayMs, expectedMs, 1e-12, 'centre delay');
    expect(centre.delaySamples).toBe(Math.round(expectedMs * 48));
    expectWithin(
      centre.quantizationErrorUs,
      (Math.round(expectedMs * 48) / 48 - expectedMs) * 1000,
      1e-9,
      'µs',
    );
    expectWithin(centre.arrivalMs, (2.5 / C20) * 1000, 1e-12, 'arrival');
    const surround = plan.channels[2];
    expectWithin(surround.distanceM!, 7.5 * 0.3048, 1e-12, 'feet → metres');
    expectWithin(surround.delayMs, ((3.0 - 2.286) / C20) * 1000, 1e-12, 'surround delay');
  });

  it('uses the sample rate for delaySamples (48000 by default) and keeps rounding within half a sample', () => {
    const input: DelayInput = {
      channels: [
        { id: 'a', distance: 4.1 },
        { id: 'b', distance: 2.37 },
      ],
    };
    const at48 = alignDelays(input);
    const at96 = alignDelays({ ...input, sampleRateHz: 96000 });
    expect(at48.sampleRateHz).toBe(48000);
    const ms = ((4.1 - 2.37) / C20) * 1000;
    expect(at48.channels[1].delaySamples).toBe(Math.round(ms * 48));
    expect(at96.channels[1].delaySamples).toBe(Math.round(ms * 96));
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.3, max: 30, noNaN: true }), { minLength: 1, maxLength: 24 }),
        fc.constantFrom(44100, 48000, 96000, 192000),
        (distances, fs) => {
          const plan = alignDelays({
            channels: distances.map((d, i) => ({ id: `c${i}`, distance: d })),
            sampleRateHz: fs,
          });
          const halfSampleUs = 1e6 / fs / 2;
          return plan.channels.every(
            (c) =>
              Math.abs(c.quantizationErrorUs) <= halfSampleUs + 1e-9 &&
              c.delayMs >= 0 &&
              Number.isInteger(c.delaySamples),
          );
        },
      ),
      { numRuns: 300 },
    );
  });

  it('changes with temperature: the same distances need less delay in warmer air', () => {
    const channels = [
      { id: 'a', distance: 6 },
      { id: 'b', distance: 3 },
    ];
    const cold = alignDelays({ channels, temperatureC: 10 }).channels[1].delayMs;
    const warm = alignDelays({ channels, temperatureC: 30 }).channels[1].delayMs;
    expectWithin(cold, (3 / (343.2 * Math.sqrt(283.15 / 293.15))) * 1000, 1e-12, '10 °C');
    expectWithin(warm, (3 / (343.2 * Math.sqrt(303.15 / 293.15))) * 1000, 1e-12, '30 °C');
  });

  it('mixes distances and measured arrivals, and warns that latency is not accounted for', () => {
    const plan = alignDelays({
      channels: [
        { id: 'M+030', distance: '3.43 m' },
        { id: 'LFE1', arrivalMs: 12 },
      ],
      speedOfSoundMps: 343,
    });
    expect(plan.referenceChannel).toBe('LFE1');
    expectWithin(plan.channels[0].delayMs, 12 - 10, 1e-12, 'delay of the distance channel');
    expect(plan.warnings.map((w) => w.code)).toEqual(['mixedArrivalSources']);
  });

  it('clamps a delay beyond limits.delayMaxMs, with a warning naming the channel', () => {
    const plan = alignDelays({
      channels: [
        { id: 'far', arrivalMs: 100 },
        { id: 'near', arrivalMs: 10 },
        { id: 'mid', arrivalMs: 40 },
      ],
      limits: { delayMaxMs: 75 },
    });
    const near = plan.channels[1];
    expect(near.clamped).toBe(true);
    expect(near.delayMs).toBe(75);
    expect(near.delaySamples).toBe(3600);
    expect(plan.channels[2]).toMatchObject({ clamped: false, delayMs: 60, delaySamples: 2880 });
    expect(plan.warnings).toEqual([expect.objectContaining({ code: 'delayClamped', channel: 'near' })]);
    expect(plan.warnings[0].message).toContain('15 ms early');
  });

  it('never rounds a clamped delay above the limit', () => {
    const plan = alignDelays({
      channels: [
        { id: 'far', arrivalMs: 50 },
        { id: 'near', arrivalMs: 0 },
      ],
      sampleRateHz: 44100,
      limits: { delayMaxMs: 0.0113 },
    });
    expect(plan.channels[1].delaySamples / 44.1).toBeLessThanOrEqual(0.0113);
  });

  it('accepts MAX_CHANNELS channels and does not modify its input', () => {
    const input = Object.freeze({
      channels: Object.freeze(
        Array.from({ length: MAX_CHANNELS }, (_, i) =>
          Object.freeze({ id: `ch${i}`, distance: 2 + i / 100 }),
        ),
      ),
    }) as unknown as DelayInput;
    const plan = alignDelays(input);
    expect(plan.channels).toHaveLength(MAX_CHANNELS);
    expect(plan.referenceChannel).toBe(`ch${MAX_CHANNELS - 1}`);
  });

  it.each([
    [{ channels: [] }, '/channels'],
    [{ channels: Array.from({ length: 129 }, (_, i) => ({ id: `c${i}`, arrivalMs: 1 })) }, '/channels'],
    [{ channels: [{ id: 'a', distance: 3, arrivalMs: 2 }] }, '/channels/0/arrivalMs'],
    [{ channels: [{ id: 'a' }] }, '/channels/0/distance'],
    [
      {
        channels: [
          { id: 'a', arrivalMs: 1 },
          { id: 'a', arrivalMs: 2 },
        ],
      },
      '/channels/1/id',
    ],
    [{ channels: [{ id: '', arrivalMs: 1 }] }, '/channels/0/id'],
    [{ channels: [{ id: 'a', arrivalMs: -0.1 }] }, '/channels/0/arrivalMs'],
    [{ channels: [{ id: 'a', arrivalMs: 1001 }] }, '/channels/0/arrivalMs'],
    [
      {
        channels: [
          { id: 'a', arrivalMs: 1 },
          { id: 'b', distance: '2 kg' },
        ],
      },
      '/channels/1/distance',
    ],
    [{ channels: [{ id: 'a', arrivalMs: 1 }], temperatureC: 20, speedOfSoundMps: 343 }, '/speedOfSoundMps'],
    [{ channels: [{ id: 'a', arrivalMs: 1 }], temperatureC: 80 }, '/temperatureC'],
    [{ channels: [{ id: 'a', arrivalMs: 1 }], limits: { delayMaxMs: -1 } }, '/limits/delayMaxMs'],
  ])('refuses %j, naming %s', (input, field) => {
    expect(catchInputError(() => alignDelays(input as DelayInput)).field).toBe(field);
  });
});
