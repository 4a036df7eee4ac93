import { designBiquads, type FilterSpec } from '../shared/filters/biquad-design';
import { responseGrid } from '../shared/dsp/grid';
import { cascadeResponse } from '../shared/dsp/response';

/*
 * DEMO DATA — invented frequency responses for Stage 3 (Kestrel Yard Post is fictional). Each is built
 * from made-up "room" filters (modes as peaks, cancellations as dips, a gentle top-end roll-off) on a
 * 1/12-octave grid from 20 Hz to 20 kHz, so the demo plan has something to correct. They are not
 * measurements of anything.
 */

const ROOM_SHAPES: Record<string, FilterSpec[]> = {
  'M+030': [
    { type: 'peaking', frequencyHz: 56, gainDb: 6, q: 4 },
    { type: 'peaking', frequencyHz: 112, gainDb: -5, q: 3 },
    { type: 'peaking', frequencyHz: 190, gainDb: 3, q: 2 },
    { type: 'highShelf', frequencyHz: 6000, gainDb: -2 },
  ],
  'M-030': [
    { type: 'peaking', frequencyHz: 58, gainDb: 5, q: 4 },
    { type: 'peaking', frequencyHz: 118, gainDb: -4, q: 3 },
    { type: 'peaking', frequencyHz: 420, gainDb: 2.5, q: 2.5 },
    { type: 'highShelf', frequencyHz: 6000, gainDb: -2 },
  ],
  'M+000': [
    { type: 'peaking', frequencyHz: 63, gainDb: 4, q: 3 },
    { type: 'peaking', frequencyHz: 150, gainDb: 3.5, q: 2 },
    { type: 'peaking', frequencyHz: 2500, gainDb: 2, q: 1.5 },
  ],
  LFE1: [
    { type: 'peaking', frequencyHz: 42, gainDb: 7, q: 5 },
    { type: 'peaking', frequencyHz: 71, gainDb: -6, q: 6 },
    { type: 'peaking', frequencyHz: 95, gainDb: 4, q: 4 },
    { type: 'lowPass', frequencyHz: 160, q: 0.7071 },
  ],
};

/** Invented measured magnitude responses (dB, arbitrary level) of four Stage 3 channels. */
export function stage3MeasuredResponses(): Record<
  string,
  { frequenciesHz: number[]; magnitudeDb: number[] }
> {
  const fs = 48000;
  const frequenciesHz = responseGrid({ fromHz: 20, toHz: 20000, pointsPerOctave: 12 }, fs);
  return Object.fromEntries(
    Object.entries(ROOM_SHAPES).map(([id, filters]) => {
      const { magnitudeDb } = cascadeResponse(designBiquads(filters, fs), frequenciesHz, fs);
      return [id, { frequenciesHz, magnitudeDb: magnitudeDb.map((db) => Math.round(db * 100) / 100) }];
    }),
  );
}

/**
 * The same invented responses with phase, as a capture with a loopback reference would give them at the
 * listening position: the phase of the invented room filters, plus the time of flight from the loudspeaker
 * (21 °C) and an invented 4 ms of interface latency. Demo data.
 */
export function stage3MeasuredResponsesWithPhase(
  distancesM: Record<string, number>,
): Record<string, { frequenciesHz: number[]; magnitudeDb: number[]; phaseDeg: number[] }> {
  const fs = 48000;
  const speedMps = 343.2 * Math.sqrt(294.15 / 293.15);
  const latencyS = 0.004;
  const frequenciesHz = responseGrid({ fromHz: 20, toHz: 20000, pointsPerOctave: 12 }, fs);
  return Object.fromEntries(
    Object.entries(ROOM_SHAPES).map(([id, filters]) => {
      const { magnitudeDb, phaseDeg } = cascadeResponse(designBiquads(filters, fs), frequenciesHz, fs);
      const delayS = distancesM[id] / speedMps + latencyS;
      return [
        id,
        {
          frequenciesHz,
          magnitudeDb: magnitudeDb.map((db) => Math.round(db * 100) / 100),
          phaseDeg: phaseDeg.map((p, i) => {
            const total = p - 360 * frequenciesHz[i] * delayS;
            return Math.round((total - 360 * Math.round(total / 360)) * 100) / 100;
          }),
        },
      ];
    }),
  );
}
