import type { components } from '../../shared/contract/api-types';
import { checkRoomDefinition } from '../../shared/geometry';
import { DEFAULT_SAMPLE_RATE_HZ } from '../../shared/limits';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import { findRoomFor, ownerScope, roomStillThere, type Caller } from './room-access';
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

  async create(caller: Caller, input: RoomCreate): Promise<RoomView> {
    const layout = checkRoomDefinition(input);
    const room = await this.db.write((transaction) =>
      this.db.models.Room.create(
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
          notes: input.notes ?? null,
        },
        { transaction },
      ),
    );
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
      await room.update(
        {
          ...(changes.name !== undefined && { name: changes.name }),
          ...(changes.limits !== undefined && { limits: changes.limits }),
          ...(changes.sampleRateHz !== undefined && { sampleRateHz: changes.sampleRateHz }),
          ...(changes.notes !== undefined && { notes: changes.notes }),
          layoutId: layout.id,
          dimensions: merged.dimensions,
          listener: merged.listener,
          loudspeakers: [...merged.loudspeakers],
        },
        { transaction },
      );
    });
    return roomDto(room);
  }

  /** A room takes its tunings, their versions and its measurements with it, in one transaction. */
  async delete(caller: Caller, roomId: string): Promise<void> {
    const { Tuning, TuningVersion, Measurement } = this.db.models;
    const room = await findRoomFor(caller, this.db.models, roomId);
    await this.db.write(async (transaction) => {
      const tunings = await Tuning.findAll({ where: { roomId: room.id }, attributes: ['id'], transaction });
      const tuningIds = tunings.map((t) => t.id);
      if (tuningIds.length > 0) await TuningVersion.destroy({ where: { tuningId: tuningIds }, transaction });
      await Tuning.destroy({ where: { roomId: room.id }, transaction });
      await Measurement.destroy({ where: { roomId: room.id }, transaction });
      await room.destroy({ transaction });
    });
  }
}
