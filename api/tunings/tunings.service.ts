import type { components } from '../../shared/contract/api-types';
import { compareTunings } from '../../shared/plan';
import { promiseOfPlan } from '../../shared/verification';
import type { Database } from '../db/database';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import { badRequest, calculateAt } from '../http/problem';
import { findRoomFor, findTuningFor, type Caller } from '../rooms/room-access';
import { TargetCurvesService } from '../target-curves/target-curves.service';
import type { HeavyWork } from '../work/heavy-work';
import { exportTuning, type ExportQuery } from './tuning-export';
import { checkPatchedChannel, planForRoom, settingsFromInput, toTuningChannel } from './tuning-input';
import type { Room } from '../db/models/room';
import type { Tuning } from '../db/models/tuning';
import type { TuningVersion } from '../db/models/tuning-version';
import { profileOfRoom, stalenessOf } from '../rooms/room-state-store';
import {
  addVersion,
  createTuning,
  findVersion,
  inBody,
  settingsOf,
  tuningDto,
  versionDto,
  type SettingPointer,
  type VersionContent,
} from './tuning-store';

type Schemas = components['schemas'];
type TuningView = ReturnType<typeof tuningDto>;
type TuningUpdate = Schemas['TuningUpdate'];

/**
 * Where a refused setting of an edited tuning sits in the PATCH body: a channel the body names is its
 * entry there (`/body/channels/<bodyIndex>/…`), the sample rate and the subwoofer when the body gives
 * them; a stored channel the edit did not touch (the room's limits changed since) is the body itself.
 */
function editPointer(body: TuningUpdate, content: VersionContent): SettingPointer {
  return (setting) => {
    const channel = /^\/channels\/(\d+)(.*)$/.exec(setting);
    if (channel) {
      const id = content.settings.channels[Number(channel[1])]?.id;
      const bodyIndex = (body.channels ?? []).findIndex((c) => c.id === id);
      return bodyIndex >= 0 ? `/body/channels/${bodyIndex}${channel[2]}` : '/body';
    }
    if (setting === '/sampleRateHz' && body.sampleRateHz !== undefined) return '/body/sampleRateHz';
    if (setting.startsWith('/subwoofer') && body.subwoofer !== undefined) return `/body${setting}`;
    return '/body';
  };
}
type VersionView = ReturnType<typeof versionDto>;

/** Tunings of stored rooms: versioned on every edit, duplicable, comparable, exportable. */
export class TuningsService {
  constructor(
    private readonly db: Database,
    private readonly work: HeavyWork,
  ) {}

  async list(caller: Caller, roomId: string, page: PageRequest): Promise<Page<TuningView>> {
    const room = await findRoomFor(caller, this.db.models, roomId);
    const found = await pageOf(this.db.models.Tuning, { roomId: room.id }, page, (t) => t);
    const data = await Promise.all(
      found.data.map(async (t) => this.view(t, await findVersion(this.db.models, t, undefined), room)),
    );
    return { data, hasMore: found.hasMore };
  }

  /** From settings per channel, or from a whole-room plan of the stored room (its errors name `/body/plan`). */
  async create(caller: Caller, roomId: string, body: Schemas['TuningCreate']) {
    const room = await findRoomFor(caller, this.db.models, roomId);
    if ((body.plan === undefined) === (body.channels === undefined)) {
      const pointer = body.plan === undefined ? '/body/channels' : '/body/plan';
      throw badRequest('Give exactly one of channels (settings per channel) or plan (a whole-room plan).', [
        { pointer, message: 'give exactly one of channels or plan' },
      ]);
    }
    const plan = body.plan && {
      ...body.plan,
      targets: body.plan.targets && {
        ...body.plan.targets,
        curve: await new TargetCurvesService(this.db).resolve(
          caller,
          body.plan.targets.curve,
          '/plan/targets/curve',
        ),
      },
    };
    const profile = plan ? await profileOfRoom(this.db.models, room) : null;
    const fromPlan = plan
      ? await calculateAt('/body/plan', () => planForRoom(this.work, room, plan, profile?.settings ?? null))
      : null;
    const settings = fromPlan
      ? fromPlan.settings
      : settingsFromInput({ ...body, channels: body.channels ?? [] }, room);
    const { tuning, version } = await createTuning(
      this.db,
      caller,
      room,
      {
        name: body.name,
        notes: body.notes ?? null,
        settings,
        origin: fromPlan ? 'plan' : 'settings',
        promise: fromPlan ? promiseOfPlan(fromPlan.plan, plan?.targets?.curve ?? null) : null,
      },
      // A plan's settings are the plan's result, so a refused one is the plan's doing.
      fromPlan ? () => '/body/plan' : inBody,
    );
    const dto = await this.view(tuning, version, room);
    return fromPlan
      ? { ...dto, planWarnings: fromPlan.plan.warnings, cautions: [...fromPlan.plan.cautions] }
      : dto;
  }

  async get(caller: Caller, tuningId: string, versionNumber?: number): Promise<TuningView> {
    const found = await findTuningFor(caller, this.db.models, tuningId);
    const version = await findVersion(this.db.models, found, versionNumber);
    return this.view(found, version, await this.db.models.Room.findByPk(found.roomId));
  }

  /** A tuning version as answered, with whether the room has changed since its settings were made. */
  private async view(tuning: Tuning, version: TuningVersion, room: Room | null): Promise<TuningView> {
    const stale = room ? await stalenessOf(this.db.models, room, version.roomRevision) : null;
    const profile = room ? await profileOfRoom(this.db.models, room) : null;
    return tuningDto(tuning, version, room, stale, profile?.settings ?? null);
  }

  async compare(
    caller: Caller,
    q: { left: string; right: string; leftVersion?: number; rightVersion?: number },
  ) {
    const left = await findTuningFor(caller, this.db.models, q.left);
    const right = await findTuningFor(caller, this.db.models, q.right);
    const leftVersion = await findVersion(this.db.models, left, q.leftVersion);
    const rightVersion = await findVersion(this.db.models, right, q.rightVersion);
    return {
      left: { tuningId: left.id, version: leftVersion.version, name: leftVersion.name },
      right: { tuningId: right.id, version: rightVersion.version, name: rightVersion.name },
      ...compareTunings(settingsOf(leftVersion), settingsOf(rightVersion)),
    };
  }

  /** Every edit is a new version; channels are merged by id, and errors name the request's entries. */
  async update(caller: Caller, tuningId: string, body: TuningUpdate): Promise<TuningView> {
    const found = await findTuningFor(caller, this.db.models, tuningId);
    const { tuning, version } = await addVersion(
      this.db,
      caller,
      found.id,
      (current) => {
        const removed = new Set(body.removeChannels ?? []);
        const channels = current.channels.filter((c) => !removed.has(c.id));
        const sampleRateHz = body.sampleRateHz ?? current.sampleRateHz;
        (body.channels ?? []).forEach((change, bodyIndex) => {
          const index = channels.findIndex((c) => c.id === change.id);
          const merged = toTuningChannel(change, index >= 0 ? channels[index] : undefined);
          checkPatchedChannel(merged, bodyIndex, sampleRateHz);
          if (index >= 0) channels[index] = merged;
          else channels.push(merged);
        });
        return {
          name: body.name ?? current.name,
          notes: body.notes !== undefined ? body.notes : current.notes,
          origin: 'edit',
          // An edit changes what it names; the rest was made from the room as it was.
          roomRevision: current.roomRevision,
          settings: {
            sampleRateHz,
            channels,
            subwoofer: body.subwoofer !== undefined ? body.subwoofer : current.subwoofer,
          },
        };
      },
      (content) => editPointer(body, content),
    );
    return this.view(tuning, version, await this.db.models.Room.findByPk(tuning.roomId));
  }

  async delete(caller: Caller, tuningId: string): Promise<void> {
    const found = await findTuningFor(caller, this.db.models, tuningId);
    await this.db.write(async (transaction) => {
      await this.db.models.TuningVersion.destroy({ where: { tuningId: found.id }, transaction });
      await found.destroy({ transaction });
    });
  }

  async duplicate(caller: Caller, tuningId: string, body: { name?: string; version?: number }) {
    const source = await findTuningFor(caller, this.db.models, tuningId);
    const version = await findVersion(this.db.models, source, body.version);
    const room = await findRoomFor(caller, this.db.models, source.roomId);
    const copy = await createTuning(
      this.db,
      caller,
      room,
      {
        name: body.name ?? `${version.name} (copy)`,
        notes: version.notes,
        settings: settingsOf(version),
        origin: 'duplicate',
        promise: version.promise ?? null,
        roomRevision: version.roomRevision,
      },
      // The copy's settings are the source version's: a refused one is that version's.
      () => (body.version !== undefined ? '/body/version' : '/path/tuningId'),
      source.id,
    );
    return this.view(copy.tuning, copy.version, room);
  }

  /** The tuning for a processor profile (tuning-export.ts), as JSON or as CSV. */
  export(caller: Caller, tuningId: string, q: ExportQuery) {
    return exportTuning(this.db, caller, tuningId, q);
  }

  async versions(caller: Caller, tuningId: string, page: PageRequest): Promise<Page<VersionView>> {
    const found = await findTuningFor(caller, this.db.models, tuningId);
    // The cursor of this list is a version number.
    const after = page.startingAfter === undefined ? 0 : Number.parseInt(String(page.startingAfter), 10) || 0;
    return pageOf(
      this.db.models.TuningVersion,
      { tuningId: found.id },
      { limit: page.limit, startingAfter: after },
      (row) => versionDto(row, caller.principal),
      'version',
    );
  }

  async version(caller: Caller, tuningId: string, versionNumber: number): Promise<VersionView> {
    const found = await findTuningFor(caller, this.db.models, tuningId);
    return versionDto(await findVersion(this.db.models, found, versionNumber), caller.principal);
  }

  /** An old version's content becomes the newest version. */
  async restore(caller: Caller, tuningId: string, versionNumber: number): Promise<TuningView> {
    const found = await findTuningFor(caller, this.db.models, tuningId);
    const old = await findVersion(this.db.models, found, versionNumber);
    const { tuning, version } = await addVersion(
      this.db,
      caller,
      found.id,
      () => ({
        name: old.name,
        notes: old.notes,
        settings: settingsOf(old),
        origin: 'restore',
        restoredFromVersion: old.version,
        roomRevision: old.roomRevision,
        promise: old.promise ?? null,
      }),
      () => () => '/path/version',
    );
    return this.view(tuning, version, await this.db.models.Room.findByPk(tuning.roomId));
  }
}
