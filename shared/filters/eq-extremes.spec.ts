import { webAudioResponses } from '../../tests/reference/web-audio';
import { logFrequencyGrid } from '../dsp/grid';
import { sosMagnitudeDb, unitCircle } from '../dsp/response';
import { presentDb } from '../present';
import { designBiquads, FILTER_TYPES, type FilterSpec } from './biquad-design';
import { eqBoostCaution, eqExtremes } from './eq-extremes';

/**
 * The plain way eqExtremes was first written, kept as its reference: the whole grid (1/48 octave from
 * 10 Hz to just below Nyquist, plus each filter's frequency) sorted, a dB array of the cascade on it, and
 * the first largest and smallest values.
 */
function denseExtremes(filters: FilterSpec[], sampleRateHz: number) {
  const { grid, db } = denseResponse(filters, sampleRateHz);
  let hi = 0;
  let lo = 0;
  for (let i = 1; i < db.length; i++) {
    if (db[i] > db[hi]) hi = i;
    if (db[i] < db[lo]) lo = i;
  }
  return {
    maxDb: db[hi],
    maxHz: grid[hi],
    minDb: db[lo],
    minHz: grid[lo],
    dbAt: (hz: number) => db[grid.indexOf(hz)],
  };
}

function denseResponse(filters: FilterSpec[], sampleRateHz: number) {
  const nyquist = sampleRateHz / 2;
  const grid = [
    ...logFrequencyGrid(10, nyquist * 0.999, 48),
    ...filters.map((f) => f.frequencyHz).filter((f) => f < nyquist),
  ].sort((a, b) => a - b);
  const db = sosMagnitudeDb(designBiquads([...filters], sampleRateHz), unitCircle(grid, sampleRateHz));
  return { grid, db };
}

/** A small seeded generator (mulberry32), so a failure names a case that can be run again. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('eqExtremes: the largest boost of the bands together, as designed', () => {
  // Independent reference: node-web-audio-api's BiquadFilterNode (lowshelf with S = 1, peaking with Q),
  // the two responses multiplied (dB added) on a fine grid around the peak; float32 inside, so 0.01 dB.
  it('a +9 dB low shelf at 30 Hz under a +12 dB peak at 40 Hz boosts 14.35 dB near 40 Hz, not 12 dB', () => {
    const filters = [
      { type: 'lowShelf' as const, frequencyHz: 30, gainDb: 9 },
      { type: 'peaking' as const, frequencyHz: 40, gainDb: 12, q: 2 },
    ];
    const x = eqExtremes(filters, 48000);
    const grid = Array.from({ length: 2001 }, (_, i) => 20 * Math.pow(4, i / 2000));
    const [shelf, peak] = webAudioResponses([
      {
        sampleRateHz: 48000,
        frequenciesHz: grid,
        biquad: { type: 'lowshelf', frequency: 30, Q: 1, gain: 9 },
      },
      {
        sampleRateHz: 48000,
        frequenciesHz: grid,
        biquad: { type: 'peaking', frequency: 40, Q: 2, gain: 12 },
      },
    ]);
    const summed = grid.map((_, i) => 20 * Math.log10(shelf.magnitude[i] * peak.magnitude[i]));
    const top = Math.max(...summed);
    expect(Math.abs(x.maxBoostDb - top)).toBeLessThan(0.01);
    expect(x.maxBoostDb).toBeGreaterThan(14.3);
    expect(Math.abs(Math.log2((x.maxBoostHz ?? 0) / grid[summed.indexOf(top)]))).toBeLessThan(1 / 48);
    // One wording for every answer: the summed figure, rounded as answers round dB and Hz.
    expect(eqBoostCaution([{ filters }], 48000)?.message).toMatch(
      /^Boosts: EQ \+14\.3\d dB at 39\.\d\d? Hz \(EQ figures are the bands together, as designed\)/,
    );
    expect(eqBoostCaution([{ channel: 'LFE1', filters, trimDb: 2 }], 48000, true)?.message).toMatch(
      /^Loading these settings puts boosts into the processor: LFE1 \(EQ \+14\.3\d dB at 39\.\d\d? Hz, trim \+2 dB\)/,
    );
  });

  it('cuts only: no boost and no caution; passes and notches are not boosts', () => {
    const cut = [{ type: 'peaking' as const, frequencyHz: 63, gainDb: -6, q: 4 }];
    expect(eqExtremes(cut, 48000)).toMatchObject({ maxBoostDb: 0, maxBoostHz: null });
    expect(eqExtremes(cut, 48000).maxCutDb).toBeCloseTo(6, 6);
    expect(eqBoostCaution([{ filters: [{ type: 'notch', frequencyHz: 60, q: 10 }] }], 48000)).toBeNull();
  });

  it('names the same extremes as the dense evaluation of the whole grid, for random EQs of every filter type', () => {
    const random = seeded(20261202);
    const rates = [8000, 44100, 48000, 96000, 192000];
    let boosts = 0;
    let plateaus = 0;
    for (let run = 0; run < 400; run++) {
      const sampleRateHz = rates[Math.floor(random() * rates.length)];
      const count = 1 + Math.floor(random() * 8);
      const filters: FilterSpec[] = Array.from({ length: count }, () => {
        const type = FILTER_TYPES[Math.floor(random() * FILTER_TYPES.length)];
        // Log-uniform from 15 Hz to just below Nyquist; every fourth on a 1/48-octave point of the grid.
        const top = (sampleRateHz / 2) * 0.95;
        let frequencyHz = 15 * Math.pow(top / 15, random());
        if (random() < 0.25)
          frequencyHz = 10 * Math.pow(2, Math.round(Math.log2(frequencyHz / 10) * 48) / 48);
        return {
          type,
          frequencyHz,
          ...(type === 'peaking' || type === 'lowShelf' || type === 'highShelf'
            ? { gainDb: Math.round((random() * 36 - 18) * 10) / 10 }
            : {}),
          ...(type === 'lowShelf' || type === 'highShelf' ? {} : { q: 0.3 + random() * 15 }),
        };
      });
      const dense = denseExtremes(filters, sampleRateHz);
      const fast = eqExtremes(filters, sampleRateHz);
      const label = JSON.stringify({ sampleRateHz, filters });
      // Equal as answers show dB: a "boost" the dense evaluation finds below 0.005 dB is rounding (an
      // all-pass), which eqExtremes calls none.
      expect([label, presentDb(fast.maxBoostDb)]).toEqual([label, presentDb(Math.max(0, dense.maxDb))]);
      expect([label, presentDb(fast.maxCutDb)]).toEqual([label, presentDb(Math.max(0, -dense.minDb))]);
      // Where there is one, the same to 1e-9 dB, at the same grid point — or, on a plateau (a shelf's flat
      // side), at a point of the same plateau: one the dense evaluation puts within 1e-9 dB of the
      // extreme, where rounding alone picks the point.
      const samePoint = (fastHz: number | null, denseHz: number, denseDb: number) =>
        fastHz === denseHz || (fastHz !== null && Math.abs(dense.dbAt(fastHz) - denseDb) < 1e-9);
      if (fast.maxBoostHz !== null) {
        boosts += 1;
        if (fast.maxBoostHz !== dense.maxHz) plateaus += 1;
        expect([label, Math.abs(fast.maxBoostDb - dense.maxDb) < 1e-9]).toEqual([label, true]);
        expect([label, samePoint(fast.maxBoostHz, dense.maxHz, dense.maxDb)]).toEqual([label, true]);
      }
      if (fast.maxCutHz !== null) {
        expect([label, Math.abs(fast.maxCutDb + dense.minDb) < 1e-9]).toEqual([label, true]);
        expect([label, samePoint(fast.maxCutHz, dense.minHz, dense.minDb)]).toEqual([label, true]);
      }
    }
    // The cases did include boosts (the comparison above is not only of cuts).
    expect(boosts).toBeGreaterThan(100);
    // …and a different point only on plateaus, rarely.
    expect(plateaus).toBeLessThan(boosts / 10);
  });

  it('an all-pass (0 dB everywhere but for rounding) neither boosts nor cuts, so no "+0 dB" caution', () => {
    for (const frequencyHz of [31.7, 410.74, 11696.3]) {
      const filters = [{ type: 'allPass' as const, frequencyHz, q: 0.7 }];
      expect(eqExtremes(filters, 48000)).toEqual({
        maxBoostDb: 0,
        maxBoostHz: null,
        maxCutDb: 0,
        maxCutHz: null,
      });
      expect(eqBoostCaution([{ filters }], 48000)).toBeNull();
    }
  });

  it('a notch exactly on its frequency reads the floor of the dB scale, as the response does', () => {
    const x = eqExtremes([{ type: 'notch', frequencyHz: 1000, q: 4 }], 48000);
    expect(x.maxCutHz).toBe(1000);
    expect(x.maxCutDb).toBe(denseExtremes([{ type: 'notch', frequencyHz: 1000, q: 4 }], 48000).minDb * -1);
  });
});
