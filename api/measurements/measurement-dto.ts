import type { Measurement } from '../db/models/measurement';

/** A few numbers that identify a measurement in a list, without its arrays. */
function summaryOf(m: Measurement): Record<string, unknown> {
  const r = m.result as Record<string, never>;
  switch (m.kind) {
    case 'impulseResponse': {
      const { arrival, level, decay, timingReference } = r as unknown as {
        arrival: { arrivalMs: number };
        level: { peakDbfs: number; energyDb: number };
        decay: { edtS: number | null; t20S: number | null; t30S: number | null };
        timingReference?: { arrivalMs: number };
      };
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
    case 'frequencyResponse': {
      const { frequenciesHz } = r as unknown as { frequenciesHz: number[] };
      return {
        points: frequenciesHz.length,
        fromHz: frequenciesHz[0],
        toHz: frequenciesHz[frequenciesHz.length - 1],
      };
    }
    case 'spl':
      return { splDb: r.splDb, weighting: r.weighting };
  }
}

/** The API shape of a stored measurement; lists leave out `result`. */
export function measurementDto(m: Measurement, withResult: boolean) {
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
