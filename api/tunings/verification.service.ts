import type { operations } from '../../shared/contract/api-types';
import { verifyTuning, type Tolerances, type Verification } from '../../shared/verification/verify';
import type { SignOff } from '../../shared/verification';
import type { Database } from '../db/database';
import type { Measurement } from '../db/models/measurement';
import { findTuningFor, type Caller } from '../rooms/room-access';
import { findVersion, settingsOf } from './tuning-store';

/** `GET /v1/tunings/{tuningId}/verification`'s query, as the contract gives it. */
export type VerificationQuery = NonNullable<operations['getTuningVerification']['parameters']['query']>;

export const storedMeasurement = (m: Measurement) => ({
  id: m.id,
  channel: m.channel,
  micPosition: m.micPosition,
  kind: m.kind,
  stage: m.stage ?? null,
  result: m.result,
});

/** Verification of a tuning version against its "after" measurements, and its sign-off. */
export class VerificationService {
  constructor(private readonly db: Database) {}

  async verify(caller: Caller, tuningId: string, q: VerificationQuery) {
    const tuning = await findTuningFor(caller, this.db.models, tuningId);
    const version = await findVersion(this.db.models, tuning, q.version);
    const after = await this.db.models.Measurement.findAll({
      where: { roomId: tuning.roomId, tuningId: tuning.id, tuningVersion: version.version, stage: 'after' },
      order: [['id', 'ASC']],
    });
    const tolerances: Partial<Tolerances> = {
      arrivalMs: q.arrivalToleranceMs,
      levelDb: q.levelToleranceDb,
      responseRmsDb: q.responseRmsToleranceDb,
      responseMaxDb: q.responseMaxToleranceDb,
      crossoverDipDb: q.crossoverDipToleranceDb,
    };
    const result = verifyTuning({
      settings: settingsOf(version),
      promise: version.promise ?? null,
      after: after.map(storedMeasurement),
      tolerances: Object.fromEntries(Object.entries(tolerances).filter(([, v]) => v !== undefined)),
      referenceDb: q.referenceDb,
      micPosition: q.micPosition,
    });
    return { tuning, version, result };
  }

  /** The API answer: the verification without the averaged responses (those are for the report's plots). */
  async answer(caller: Caller, tuningId: string, q: VerificationQuery) {
    const { tuning, version, result } = await this.verify(caller, tuningId, q);
    const { responses: _plots, ...rest }: Verification = result;
    return { tuningId: tuning.id, version: version.version, ...rest, signOff: version.signOff ?? null };
  }

  /** Stores the sign-off with the version, with the verdict of the verification at that moment. */
  async signOff(
    caller: Caller,
    tuningId: string,
    versionNumber: number,
    body: Omit<SignOff, 'verdict' | 'signedAt'>,
    now: Date,
  ) {
    const { tuning, version, result } = await this.verify(caller, tuningId, { version: versionNumber });
    const signOff: SignOff = { ...body, verdict: result.verdict, signedAt: now.toISOString() };
    await this.db.write(async (transaction) => {
      const row = await this.db.models.TuningVersion.findByPk(version.id, { transaction });
      if (!row) throw new Error('version vanished');
      await row.update({ signOff }, { transaction });
    });
    return { tuningId: tuning.id, version: version.version, signOff };
  }
}
