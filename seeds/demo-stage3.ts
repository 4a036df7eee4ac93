import { newId } from '../api/db/ids';
import type { Services } from '../api/services';
import { checkRoomDefinition } from '../shared/geometry';
import { checkTuningSettings, planRoom, planToTuningSettings, type PlanInput } from '../shared/plan';
import { recordRoomState } from '../api/rooms/room-state-store';
import { findLimitViolations } from '../shared/plan/tuning-limits';
import { STAGE3_PROFILE, STAGE3_REFERENCE_DB, STAGE3_ROOM, STAGE3_SPL_DB } from './demo-stage3-room';
import { stage3MeasuredResponses } from './demo-stage3-measurements';

/** The demo developer owns the room (the "Sweep rig — Stage 3" key is theirs). */
const DEMO_OWNER_EMAIL = 'dev@kestrel.example';

function stage3Plan(bassManaged: boolean): PlanInput {
  const responses = stage3MeasuredResponses();
  return {
    layout: STAGE3_ROOM.layout,
    room: STAGE3_ROOM.dimensions,
    listener: STAGE3_ROOM.listener,
    channels: STAGE3_ROOM.loudspeakers.map(({ id, x, y, z }) => ({
      id,
      position: { x, y, z },
      measuredDb: STAGE3_SPL_DB[id],
      ...(responses[id] && { measuredResponse: responses[id] }),
      bassManaged: bassManaged && !id.startsWith('LFE'),
    })),
    // T60 0.30 s is the invented decay of the demo impulse response: the EQ stops at 2000·√(0.3/V) ≈ 93 Hz.
    targets: { referenceDb: STAGE3_REFERENCE_DB, crossoverHz: 80, reverberationTimeS: 0.3 },
    limits: STAGE3_ROOM.limits,
    processorEq: STAGE3_PROFILE.eq,
    temperatureC: 21,
    sampleRateHz: STAGE3_ROOM.sampleRateHz,
  };
}

/**
 * DEMO DATA — the invented room Stage 3 of Kestrel Yard Post (PRODUCT.md §7) with two tunings computed
 * by the whole-room plan from invented SPL readings and responses: bass-managed at 80 Hz (LR4) and full
 * range, both within the room's limits and its processor profile. Loaded into an empty database only,
 * after the demo users.
 */
export async function seedDemoStage3(services: Services): Promise<void> {
  const { User, Room, Tuning, TuningVersion, ProcessorProfile } = services.db.models;
  const owner = await User.findOne({ where: { email: DEMO_OWNER_EMAIL } });
  if (!owner) throw new Error(`demo seed: ${DEMO_OWNER_EMAIL} is missing; load the demo users first`);
  const layout = checkRoomDefinition(STAGE3_ROOM);
  const variants = [
    { name: 'Bass-managed 80 Hz (demo)', settings: planToTuningSettings(planRoom(stage3Plan(true))) },
    { name: 'Full range (demo)', settings: planToTuningSettings(planRoom(stage3Plan(false))) },
  ];
  const { name: profileName, ...profileSettings } = STAGE3_PROFILE;
  variants.forEach((v) => {
    checkTuningSettings(v.settings);
    const outside = findLimitViolations(v.settings, STAGE3_ROOM.limits, profileSettings);
    if (outside.length > 0) throw new Error(`demo seed: ${v.name}: ${outside[0].message}`);
  });
  await services.db.write(async (transaction) => {
    const profile = await ProcessorProfile.create(
      { id: newId('prof'), ownerId: owner.id, name: profileName, settings: profileSettings },
      { transaction },
    );
    const room = await Room.create(
      {
        id: newId('room'),
        ownerId: owner.id,
        name: STAGE3_ROOM.name,
        layoutId: layout.id,
        dimensions: STAGE3_ROOM.dimensions,
        listener: STAGE3_ROOM.listener,
        loudspeakers: STAGE3_ROOM.loudspeakers,
        limits: STAGE3_ROOM.limits,
        sampleRateHz: STAGE3_ROOM.sampleRateHz,
        profileId: profile.id,
        notes: STAGE3_ROOM.notes,
      },
      { transaction },
    );
    await recordRoomState(services.db.models, room, transaction);
    for (const variant of variants) {
      const tuning = await Tuning.create(
        {
          id: newId('tun'),
          roomId: room.id,
          ownerId: owner.id,
          name: variant.name,
          currentVersion: 1,
          duplicatedFromId: null,
        },
        { transaction },
      );
      await TuningVersion.create(
        {
          id: newId('tver'),
          tuningId: tuning.id,
          version: 1,
          name: variant.name,
          notes: 'Demo data: computed from invented SPL readings and invented responses.',
          sampleRateHz: variant.settings.sampleRateHz,
          channels: variant.settings.channels,
          subwoofer: variant.settings.subwoofer,
          origin: 'plan',
          restoredFromVersion: null,
          roomRevision: room.stateRevision,
          createdByUserId: owner.id,
          createdByKeyId: null,
        },
        { transaction },
      );
    }
  });
}
