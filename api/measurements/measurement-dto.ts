import type { components } from '../../shared/contract/api-types';
import type { Measurement } from '../db/models/measurement';

type Schemas = components['schemas'];

/**
 * A few numbers that identify a measurement in a list, without its arrays (the contract's `summary`). The
 * stored result's shape follows the kind: only an impulse response's analysis has an `arrival`, only a
 * frequency response has top-level `frequenciesHz`.
 */
function summaryOf(m: Measurement): Schemas['Measurement']['summary'] {
  const r = m.result;
  if ('arrival' in r) {
    const { arrival, level, decay, timingReference } = r;
    return {
      arrivalMs: arrival.arrivalMs,
      // What plans use as the loudspeaker's delay: the arrival counted from the timing reference.
      ...(timingReference && { arrivalFromReferenceMs: arrival.arrivalMs - timingReference.arrivalMs }),
      peakDbfs: level.peakDbfs,
      energyDb: level.energyDb,
      edtS: decay.edtS,
      t20S: decay.t20S,
      t30S: decay.t30S,
    };
  }
  if ('frequenciesHz' in r) {
    const { frequenciesHz } = r;
    return {
      points: frequenciesHz.length,
      fromHz: frequenciesHz[0],
      toHz: frequenciesHz[frequenciesHz.length - 1],
    };
  }
  return { splDb: r.splDb, weighting: r.weighting };
}

/** The API shape of a stored measurement; lists leave out `result`. */
export function measurementDto(m: Measurement, withResult: boolean): Schemas['Measurement'] {
  return {
    id: m.id,
    roomId: m.roomId,
    channel: m.channel,
    micPosition: m.micPosition,
    kind: m.kind,
    name: m.name,
    notes: m.notes,
    source: m.source,
    summary: summaryOf(m),
    ...(withResult && { result: m.result }),
    tuningId: m.tuningId ?? null,
    tuningVersion: m.tuningVersion ?? null,
    stage: m.stage ?? 'before',
    createdAt: m.createdAt.toISOString(),
  };
}
