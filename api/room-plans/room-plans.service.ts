import type { components } from '../../shared/contract/api-types';
import { planStoredRoom, planToTuningSettings, type StoredRoomPlan } from '../../shared/plan';
import { promiseOfPlan } from '../../shared/verification';
import type { Database } from '../db/database';
import type { Room } from '../db/models/room';
import { calculateAt } from '../http/problem';
import { findRoomFor, type Caller } from '../rooms/room-access';
import { TargetCurvesService } from '../target-curves/target-curves.service';
import { profileOfRoom, stalenessOf } from '../rooms/room-state-store';
import { createTuning, tuningDto } from '../tunings/tuning-store';

type RoomPlanRequest = components['schemas']['RoomPlanRequest'];
type TuningView = ReturnType<typeof tuningDto>;

const DEFAULT_TUNING_NAME = 'Plan from measurements';

/** Plans of stored rooms: inputs assembled from the room and its measurements, one plan engine. */
export class RoomPlansService {
  constructor(private readonly db: Database) {}

  /** The plan; with `store`, also the tuning it was saved as (version 1, through the tuning checks). */
  async plan(
    caller: Caller,
    roomId: string,
    body: RoomPlanRequest,
  ): Promise<StoredRoomPlan & { tuning?: TuningView }> {
    const room = await findRoomFor(caller, this.db.models, roomId);
    const profile = await profileOfRoom(this.db.models, room);
    const targets = body.targets && {
      ...body.targets,
      curve: await calculateAtAsync(() =>
        new TargetCurvesService(this.db).resolve(caller, body.targets?.curve, '/targets/curve'),
      ),
    };
    const rows = await this.db.models.Measurement.findAll({
      where: { roomId: room.id },
      order: [['id', 'ASC']],
    });
    const plan = calculateAt('/body', () =>
      planStoredRoom(
        { ...storedRoomOf(room), profile: profile?.settings ?? null },
        rows.map((m) => ({
          id: m.id,
          channel: m.channel,
          micPosition: m.micPosition,
          kind: m.kind,
          stage: m.stage ?? null,
          result: m.result,
        })),
        {
          targets,
          temperatureC: body.temperatureC,
          sampleRateHz: body.sampleRateHz,
          bassManaged: body.bassManaged,
          measurements: body.measurements,
        },
      ),
    );
    if (!body.store) return plan;
    // The room's limits check every stored setting; one the plan computed outside them is the plan's doing.
    const { tuning, version } = await createTuning(
      this.db,
      caller,
      room,
      {
        name: body.name ?? DEFAULT_TUNING_NAME,
        notes: body.notes ?? null,
        settings: planToTuningSettings(plan),
        origin: 'plan',
        promise: promiseOfPlan(plan, targets?.curve ?? null),
      },
      () => '/body/store',
    );
    const stale = await stalenessOf(this.db.models, room, version.roomRevision);
    return { ...plan, tuning: tuningDto(tuning, version, room, stale, profile?.settings ?? null) };
  }
}

function storedRoomOf(room: Room) {
  return {
    layoutId: room.layoutId,
    dimensions: room.dimensions,
    listener: room.listener,
    loudspeakers: room.loudspeakers,
    limits: room.limits,
    sampleRateHz: room.sampleRateHz,
  };
}

/** Like calculateAt('/body', …) for an asynchronous step: a core field error becomes a /body pointer. */
async function calculateAtAsync<T>(step: () => Promise<T>): Promise<T> {
  try {
    return await step();
  } catch (error) {
    return calculateAt('/body', () => {
      throw error;
    });
  }
}
