import type { operations } from '../../shared/contract/api-types';
import { CalculationInputError } from '../../shared/errors';
import { findLayout } from '../../shared/layouts';
import { tuningCautions } from '../../shared/plan';
import { findLimitViolations } from '../../shared/plan/tuning-limits';
import { processorExportToCsv, type ExportHeader } from '../../shared/processor/export-csv';
import { profileStepRounding } from '../../shared/processor/profile-steps';
import {
  EXACT_LAYOUT,
  exportForProcessor,
  type ProcessorExport,
} from '../../shared/processor/processor-export';
import type { Database } from '../db/database';
import type { ProcessorProfileRow } from '../db/models/processor-profile';
import { ProblemError } from '../http/problem';
import { ProfilesService } from '../profiles/profiles.service';
import { findRoomFor, findTuningFor, type Caller } from '../rooms/room-access';
import { profileOfRoom, stalenessOf } from '../rooms/room-state-store';
import { ISOCHRON_VERSION } from '../service/version';
import { findVersion, settingsOf } from './tuning-store';

const CONVENTION =
  'Sections are normalised a0 = 1. feedbackSign plus: H(z) = (b0 + b1 z^-1 + b2 z^-2) / (1 + a1 z^-1 + a2 z^-2); minus: the denominator is 1 - a1 z^-1 - a2 z^-2 (a1, a2 written negated). Coefficients in coefficientLayout.order.';

/** Rounding that costs more than this in any channel's EQ gets a caution, dB (common practice: 0.5 dB is audible at low frequencies). */
const ROUNDING_CAUTION_DB = 0.5;

/** `GET /v1/tunings/{tuningId}/export`'s query, the format filled in with the contract's default. */
export type ExportQuery = NonNullable<operations['exportTuning']['parameters']['query']> & {
  format: 'json' | 'csv';
};

function refused(violations: ReturnType<typeof findLimitViolations>): ProblemError {
  return new ProblemError({
    status: 422,
    title: "Outside the processor profile's limits",
    type: 'limit-exceeded',
    detail: `${violations[0].message}. Nothing was exported; choose another profile or change the tuning.`,
    errors: violations.map((v) => ({
      pointer: v.setting === '/sampleRateHz' ? '/query/sampleRateHz' : '/query/profile',
      message: v.message,
      setting: v.setting,
      limit: v.limit,
    })),
  });
}

/**
 * A stored tuning as one processor takes it (exportForProcessor), with its header: the tuning, the
 * room, the sample rate, the profile, when the version was made, this Isochron's version, the stale
 * notice first and the cautions (boosts reach the processor here; what rounding cost; which settings
 * are not on the profile's steps and what they become).
 */
export async function exportTuning(
  db: Database,
  caller: Caller,
  tuningId: string,
  q: ExportQuery,
): Promise<{ csv: string; fileName: string } | { json: object }> {
  const found = await findTuningFor(caller, db.models, tuningId);
  const version = await findVersion(db.models, found, q.version);
  const room = await findRoomFor(caller, db.models, found.roomId);
  let profile: ProcessorProfileRow | null;
  if (q.profile === 'none') profile = null;
  else if (q.profile) profile = await new ProfilesService(db).find(caller, q.profile);
  else profile = await profileOfRoom(db.models, room);
  const sampleRateHz = q.sampleRateHz ?? version.sampleRateHz;
  const settings = { ...settingsOf(version), sampleRateHz };
  if (profile) {
    const outside = findLimitViolations(settings, null, profile.settings);
    if (outside.length > 0) throw refused(outside);
  }
  let exported: ProcessorExport;
  try {
    exported = exportForProcessor(settings, sampleRateHz, profile?.settings ?? EXACT_LAYOUT);
  } catch (error) {
    if (!(error instanceof CalculationInputError)) throw error;
    throw new ProblemError({
      status: 422,
      title: 'Value cannot be used',
      type: 'calculation-input',
      detail: `The stored filter at ${error.field} cannot be designed at ${sampleRateHz} Hz: ${error.message}`,
      errors: [{ pointer: '/query/sampleRateHz', message: `stored filter ${error.field}: ${error.message}` }],
    });
  }
  const cautions = tuningCautions(settings, {
    layout: findLayout(room.layoutId),
    limits: room.limits,
    forExport: true,
  });
  const costly = exported.channels.filter((c) => c.eqRounding.maxDeviationDb > ROUNDING_CAUTION_DB);
  if (costly.length > 0) {
    cautions.push({
      code: 'roundingCost',
      message: `Rounding to the processor's steps and number format moves the EQ of ${costly
        .map(
          (c) =>
            `${c.id} by ${c.eqRounding.maxDeviationDb.toFixed(2)} dB at ${(c.eqRounding.atHz ?? 0).toFixed(2)} Hz`,
        )
        .join(', ')}; check those channels by measurement after loading, or use a finer profile.`,
    });
  }
  const steps = profile ? profileStepRounding(settings, profile.settings) : [];
  if (steps.length > 0) {
    cautions.push({
      code: 'profileSteps',
      message: `${steps.length} setting${steps.length === 1 ? ' is' : 's are'} not on the processor's steps and ${steps.length === 1 ? 'is' : 'are'} exported rounded: ${steps.map((s) => s.message).join('; ')}.`,
    });
  }
  const stale = await stalenessOf(db.models, room, version.roomRevision);
  const header: ExportHeader = {
    stale,
    tuningId: found.id,
    version: version.version,
    name: version.name,
    roomId: room.id,
    roomName: room.name,
    sampleRateHz,
    profile: profile ? { id: profile.id, name: profile.name } : null,
    createdAt: version.createdAt.toISOString(),
    isochronVersion: ISOCHRON_VERSION,
    convention: CONVENTION,
    cautions,
  };
  if (q.format === 'csv') {
    return {
      csv: processorExportToCsv(header, exported),
      fileName: `${found.id}-v${version.version}-${sampleRateHz}.csv`,
    };
  }
  const { stale: _stale, ...rest } = header;
  return {
    json: {
      stale,
      header: rest,
      coefficientLayout: exported.coefficientLayout,
      channels: exported.channels,
      bassManagement: exported.bassManagement,
    },
  };
}
