import {
  correctResponse,
  offsetFromSensitivity,
  parseCalibrationText,
  type MicrophoneSensitivity,
} from '../../shared/capture/microphone';
import type { components } from '../../shared/contract/api-types';
import { CalculationInputError } from '../../shared/errors';
import { can } from '../auth/permissions';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import type { Microphone, SplOffset, StoredCalibration } from '../db/models/microphone';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import { forbidden, notFound } from '../http/problem';
import type { UploadedFile } from '../http/validate';
import type { Caller } from '../rooms/room-access';
import type { HeavyWork } from '../work/heavy-work';

type MicrophoneCreate = components['schemas']['MicrophoneCreate'];
type MicrophoneUpdate = components['schemas']['MicrophoneUpdate'];
export type MicrophoneView = components['schemas']['Microphone'];
export type MicrophoneCorrection = components['schemas']['MicrophoneCorrection'];

const view = (mic: Microphone): MicrophoneView => ({
  id: mic.id,
  name: mic.name,
  serial: mic.serial,
  notes: mic.notes,
  calibration: mic.calibration && {
    fileName: mic.calibration.fileName,
    points: mic.calibration.frequenciesHz.length,
    fromHz: mic.calibration.frequenciesHz[0],
    toHz: mic.calibration.frequenciesHz[mic.calibration.frequenciesHz.length - 1],
    frequenciesHz: mic.calibration.frequenciesHz,
    magnitudeDb: mic.calibration.magnitudeDb,
    ...(mic.calibration.phaseDeg && { phaseDeg: mic.calibration.phaseDeg }),
  },
  sensitivity: mic.sensitivity,
  splOffset: mic.splOffset,
  createdAt: mic.createdAt.toISOString(),
  updatedAt: mic.updatedAt.toISOString(),
});

function calibrationOf(text: string, fileName: string | null | undefined): StoredCalibration {
  return { ...parseCalibrationText(text, '/calibrationText'), fileName: fileName ?? null };
}

function offsetOfSensitivity(sensitivity: MicrophoneSensitivity | null): SplOffset | null {
  const offsetDb = offsetFromSensitivity(sensitivity);
  return offsetDb === null ? null : { offsetDb, source: 'sensitivity' };
}

/**
 * Measurement microphones: stored per owner and seen by that owner only (admins included: a calibration
 * belongs to whoever measures with it). Every write goes through the write queue.
 */
export class MicrophonesService {
  constructor(
    private readonly db: Database,
    private readonly work: Pick<HeavyWork, 'run'>,
  ) {}

  list(caller: Caller, page: PageRequest): Promise<Page<MicrophoneView>> {
    return pageOf(this.db.models.Microphone, { ownerId: caller.principal.userId }, page, view);
  }

  async get(caller: Caller, id: string): Promise<MicrophoneView> {
    return view(await this.find(caller, id));
  }

  async create(caller: Caller, input: MicrophoneCreate): Promise<MicrophoneView> {
    if (input.calibrationFileName !== undefined && input.calibrationText === undefined) {
      throw new CalculationInputError(
        'a calibration file name needs calibrationText',
        '/calibrationFileName',
      );
    }
    const calibration =
      input.calibrationText === undefined
        ? null
        : calibrationOf(input.calibrationText, input.calibrationFileName);
    const sensitivity = input.sensitivity ?? null;
    const mic = await this.db.write((transaction) =>
      this.db.models.Microphone.create(
        {
          id: newId('mic'),
          ownerId: caller.principal.userId,
          name: input.name,
          serial: input.serial ?? null,
          notes: input.notes ?? null,
          calibration,
          sensitivity: sensitivity as MicrophoneSensitivity | null,
          splOffset: offsetOfSensitivity(sensitivity as MicrophoneSensitivity | null),
        },
        { transaction },
      ),
    );
    return view(mic);
  }

  async update(caller: Caller, id: string, changes: MicrophoneUpdate): Promise<MicrophoneView> {
    const found = await this.find(caller, id);
    if (changes.calibrationFileName && changes.calibrationText === undefined && !found.calibration) {
      throw new CalculationInputError('a calibration file name needs a calibration', '/calibrationFileName');
    }
    const calibration =
      changes.calibrationText === undefined
        ? undefined
        : changes.calibrationText === null
          ? null
          : calibrationOf(
              changes.calibrationText,
              changes.calibrationFileName ?? found.calibration?.fileName,
            );
    const mic = await this.db.write(async (transaction) => {
      const current = await this.db.models.Microphone.findByPk(found.id, { transaction });
      if (!current) throw notFound(`No microphone ${id}.`);
      const sensitivity = changes.sensitivity as MicrophoneSensitivity | null | undefined;
      const renamedFile =
        calibration === undefined && changes.calibrationFileName !== undefined && current.calibration
          ? { ...current.calibration, fileName: changes.calibrationFileName }
          : undefined;
      return current.update(
        {
          ...(changes.name !== undefined && { name: changes.name }),
          ...(changes.serial !== undefined && { serial: changes.serial }),
          ...(changes.notes !== undefined && { notes: changes.notes }),
          ...(calibration !== undefined && { calibration }),
          ...(renamedFile && { calibration: renamedFile }),
          ...(sensitivity !== undefined && {
            sensitivity,
            // A sensitivity in dBFS sets the offset; removing it removes an offset that came from it.
            splOffset:
              offsetOfSensitivity(sensitivity) ??
              (current.splOffset?.source === 'calibrator' ? current.splOffset : null),
          }),
        },
        { transaction },
      );
    });
    return view(mic);
  }

  async delete(caller: Caller, id: string): Promise<void> {
    const mic = await this.find(caller, id);
    await this.db.write((transaction) => mic.destroy({ transaction }));
  }

  /** A calibrator recording read on a worker thread; its offset replaces the microphone's. */
  async readCalibrator(
    caller: Caller,
    id: string,
    form: { channel?: number; calibratorLevelDb: number; inputGain?: string },
    file: UploadedFile,
  ) {
    const found = await this.find(caller, id);
    const reading = await this.work.run('readCalibratorWav', {
      bytes: file.buffer,
      channel: form.channel,
      calibratorLevelDb: form.calibratorLevelDb,
    });
    const splOffset: SplOffset = {
      offsetDb: reading.splOffsetDb,
      source: 'calibrator',
      calibratorLevelDb: reading.calibratorLevelDb,
      measuredFrequencyHz: reading.measuredFrequencyHz,
      rmsDbfs: reading.rmsDbfs,
      inputGain: form.inputGain ?? null,
      measuredAt: new Date().toISOString(),
    };
    const mic = await this.db.write(async (transaction) => {
      const current = await this.db.models.Microphone.findByPk(found.id, { transaction });
      if (!current) throw notFound(`No microphone ${id}.`);
      return current.update({ splOffset }, { transaction });
    });
    return { microphone: view(mic), reading };
  }

  /**
   * The microphone a request names, for correcting its analysis. Only keys and users that may store
   * tunings have microphones (403 otherwise); an id the caller does not own is a 422 naming `field`, the
   * same answer as an id that does not exist.
   */
  async resolve(caller: Caller, id: string | undefined, field: string): Promise<Microphone | undefined> {
    if (id === undefined) return undefined;
    if (!can(caller.principal, 'tuning')) {
      throw forbidden(
        'Naming a microphone needs a key or user that may store tunings (role tuning or admin).',
      );
    }
    const mic = await this.db.models.Microphone.findOne({ where: { id, ownerId: caller.principal.userId } });
    if (!mic) throw new CalculationInputError(`you have no microphone ${id}`, field);
    return mic;
  }

  private async find(caller: Caller, id: string): Promise<Microphone> {
    const mic = await this.db.models.Microphone.findOne({ where: { id, ownerId: caller.principal.userId } });
    if (!mic) throw notFound(`No microphone ${id}.`);
    return mic;
  }
}

type Warning = components['schemas']['Warning'];

type Analysed = {
  frequencyResponse: { frequenciesHz: number[]; magnitudeDb: number[]; phaseDeg?: number[] };
  warnings: Warning[];
};

/**
 * An analysis (or a stored frequency response) corrected with the microphone: its calibration subtracted
 * from the response, the response also in dB SPL when the microphone has an offset (the level a sine at
 * `playedPeakDbfs` would produce: response + played level − 3.01 dB (sine RMS) + offset; not for a
 * response whose reference is unknown, `playedPeakDbfs` null), and a
 * `microphone` block saying what was done, with a warning when the calibration was held flat.
 */
export function withMicrophone<T extends Analysed>(
  analysis: T,
  mic: Microphone | undefined,
  playedPeakDbfs: number | null,
): T & { microphone?: MicrophoneCorrection } {
  if (!mic) return analysis;
  const { response, applied } = mic.calibration
    ? correctResponse(analysis.frequencyResponse, mic.calibration)
    : { response: analysis.frequencyResponse, applied: null };
  const warnings = [...analysis.warnings];
  if (applied && (applied.heldFlatBelowHz !== null || applied.heldFlatAboveHz !== null)) {
    const ends = [
      applied.heldFlatBelowHz !== null && `below ${applied.heldFlatBelowHz} Hz`,
      applied.heldFlatAboveHz !== null && `above ${applied.heldFlatAboveHz} Hz`,
    ].filter(Boolean);
    warnings.push({
      code: 'calibrationHeldFlat',
      message: `The microphone's calibration covers ${applied.calibratedFromHz}–${applied.calibratedToHz} Hz; ${ends.join(' and ')} its end value was used. Read the response there with care.`,
    });
  }
  if (!mic.calibration) {
    warnings.push({
      code: 'noCalibration',
      message: `Microphone ${mic.name} has no calibration; the response is not corrected.`,
    });
  }
  const offset = mic.splOffset?.offsetDb ?? null;
  const sineRmsDb = 20 * Math.log10(Math.SQRT1_2);
  const frequencyResponse =
    offset === null || playedPeakDbfs === null
      ? response
      : {
          ...response,
          splDb: response.magnitudeDb.map((db) => round2(db + playedPeakDbfs + sineRmsDb + offset)),
          splForPeakDbfs: playedPeakDbfs,
        };
  return {
    ...analysis,
    frequencyResponse,
    warnings,
    microphone: {
      id: mic.id,
      name: mic.name,
      serial: mic.serial,
      correctionApplied: applied !== null,
      ...(applied && applied),
      splOffsetDb: offset,
    },
  };
}

const round2 = (v: number) => Math.round(v * 100) / 100;
