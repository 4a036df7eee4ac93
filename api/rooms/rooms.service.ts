import type { components } from '../../shared/contract/api-types';
import { checkRoomDefinition } from '../../shared/geometry';
import { DEFAULT_SAMPLE_RATE_HZ } from '../../shared/limits';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import type { Transaction } from 'sequelize';
import { ProblemError } from '../http/problem';
import { findRoomFor, ownerScope, roomStillThere, type Caller } from './room-access';
import { recordRoomState } from './room-state-store';
import { roomDto, type RoomView } from './room-dto';

type RoomCreate = components['schemas']['RoomCreate'];
type RoomUpdate = components['schemas']['RoomUpdate'];

/** Stored rooms: a caller's own (every room for admins). Every write goes through the write queue. */
export class RoomsService {
  constructor(private readonly db: Database) {}

  list(caller: Caller, page: PageRequest): Promise<Page<RoomView>> {
    return pageOf(this.db.models.Room, ownerScope(caller), page, roomDto);
  }

  async get(caller: Caller, roomId: string): Promise<RoomView> {
    return roomDto(await findRoomFor(caller, this.db.models, roomId));
  }

  /** A room may use only its owner's profiles; anything else is named as not found. */
  private async requireProfile(
    profileId: string | null | undefined,
    ownerId: string,
    pointer: string,
    transaction: Transaction,
  ): Promise<void> {
    if (!profileId) return;
    const profile = await this.db.models.ProcessorProfile.findByPk(profileId, { transaction });
    if (!profile || profile.ownerId !== ownerId) {
      throw new ProblemError({
        status: 422,
        title: 'Value cannot be used',
        type: 'calculation-input',
        detail: `No processor profile ${profileId} of the room's owner.`,
        errors: [{ pointer, message: `no processor profile ${profileId} of the room's owner` }],
      });
    }
  }

  async create(caller: Caller, input: RoomCreate): Promise<RoomView> {
    const layout = checkRoomDefinition(input);
    const room = await this.db.write(async (transaction) => {
      await this.requireProfile(input.profileId, caller.principal.userId, '/body/profileId', transaction);
      const room = await this.db.models.Room.create(
        {
          id: newId('room'),
          ownerId: caller.principal.userId,
          name: input.name,
          layoutId: layout.id,
          dimensions: input.dimensions,
          listener: input.listener,
          loudspeakers: [...input.loudspeakers],
          limits: input.limits ?? null,
          sampleRateHz: input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ,
          profileId: input.profileId ?? null,
          notes: input.notes ?? null,
        },
        { transaction },
      );
      await recordRoomState(this.db.models, room, transaction);
      return room;
    });
    return roomDto(room);
  }

  async update(caller: Caller, roomId: string, changes: RoomUpdate): Promise<RoomView> {
    const room = await findRoomFor(caller, this.db.models, roomId);
    const merged = {
      layout: changes.layout ?? room.layoutId,
      dimensions: changes.dimensions ?? room.dimensions,
      listener: changes.listener ?? room.listener,
      loudspeakers: changes.loudspeakers ?? room.loudspeakers,
    };
    const layout = checkRoomDefinition(merged);
    await this.db.write(async (transaction) => {
      await roomStillThere(this.db.models, room.id, transaction);
      await this.requireProfile(changes.profileId, room.ownerId, '/body/profileId', transaction);
      await room.update(
        {
          ...(changes.name !== undefined && { name: changes.name }),
          ...(changes.limits !== undefined && { limits: changes.limits }),
          ...(changes.sampleRateHz !== undefined && { sampleRateHz: changes.sampleRateHz }),
          ...(changes.profileId !== undefined && { profileId: changes.profileId }),
          ...(changes.notes !== undefined && { notes: changes.notes }),
          layoutId: layout.id,
          dimensions: merged.dimensions,
          listener: merged.listener,
          loudspeakers: [...merged.loudspeakers],
        },
        { transaction },
      );
      await recordRoomState(this.db.models, room, transaction);
    });
    return roomDto(room);
  }

  /** A room takes its tunings, their versions and its measurements with it, in one transaction. */
  async delete(caller: Caller, roomId: string): Promise<void> {
    const { Tuning, TuningVersion, Measurement } = this.db.models;
    const room = await findRoomFor(caller, this.db.models, roomId);
    await this.db.write(async (transaction) => {
      // PostgreSQL: writes for this room from other instances wait, then find it gone (404).
      await this.db.models.Room.findByPk(room.id, { transaction, lock: transaction.LOCK.UPDATE });
      const tunings = await Tuning.findAll({ where: { roomId: room.id }, attributes: ['id'], transaction });
      const tuningIds = tunings.map((t) => t.id);
      if (tuningIds.length > 0) await TuningVersion.destroy({ where: { tuningId: tuningIds }, transaction });
      await Tuning.destroy({ where: { roomId: room.id }, transaction });
      await Measurement.destroy({ where: { roomId: room.id }, transaction });
      await this.db.models.RoomState.destroy({ where: { roomId: room.id }, transaction });
      await room.destroy({ transaction });
    });
  }
}
