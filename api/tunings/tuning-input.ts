import type { components } from '../../shared/contract/api-types';
import { CalculationInputError } from '../../shared/errors';
import {
  checkTuningSettings,
  planToTuningSettings,
  type PlanChannelInput,
  type PlanInput,
  type RoomPlan,
  type TuningChannel,
  type TuningSettings,
  type TuningSubwoofer,
} from '../../shared/plan';
import type { Room } from '../db/models/room';
import type { ProcessorProfileSettings } from '../../shared/processor/profile';
import type { HeavyWork } from '../work/heavy-work';

/**
 * A channel as a request gives it (the contract's `TuningChannelInput`); everything but the id and the two
 * numbers may be left out.
 */
export type ChannelInput = components['schemas']['TuningChannelInput'];

export function toTuningChannel(input: ChannelInput, base?: TuningChannel): TuningChannel {
  const highPass = input.highPass !== undefined ? input.highPass : (base?.highPass ?? null);
  return {
    id: input.id,
    ...((input.name ?? base?.name) !== undefined && { name: input.name ?? base?.name }),
    delayMs: input.delayMs ?? base?.delayMs ?? 0,
    trimDb: input.trimDb ?? base?.trimDb ?? 0,
    polarity: input.polarity ?? base?.polarity ?? 'normal',
    eq: input.eq ?? base?.eq ?? [],
    highPass,
    bassManaged: input.bassManaged ?? base?.bassManaged ?? highPass !== null,
  };
}

export function settingsFromInput(
  body: { sampleRateHz?: number; channels: ChannelInput[]; subwoofer?: TuningSubwoofer | null },
  room: Room,
): TuningSettings {
  return {
    sampleRateHz: body.sampleRateHz ?? room.sampleRateHz,
    channels: body.channels.map((c) => toTuningChannel(c)),
    subwoofer: body.subwoofer ?? null,
  };
}

/**
 * Runs the whole-room plan for a stored room: layout, room, listener, limits and sample rate come from
 * the room unless the request gives them, and a channel without position, distance or arrival takes
 * the stored loudspeaker's position. Without channels, every stored loudspeaker is planned.
 * Errors name fields of the plan (the caller places them in the request). The plan runs on a worker
 * thread.
 */
export async function planForRoom(
  work: HeavyWork,
  room: Room,
  plan: Partial<PlanInput>,
  profile: ProcessorProfileSettings | null = null,
): Promise<{ plan: RoomPlan; settings: TuningSettings }> {
  const stored = new Map(room.loudspeakers.map((s) => [s.id, { x: s.x, y: s.y, z: s.z }]));
  const requested: PlanChannelInput[] = plan.channels ?? room.loudspeakers.map((s) => ({ id: s.id }));
  const channels = requested.map((c) =>
    c.position || c.distance !== undefined || c.arrivalMs !== undefined || !stored.has(c.id)
      ? c
      : { ...c, position: stored.get(c.id) },
  );
  const input: PlanInput = {
    ...plan,
    layout: plan.layout ?? room.layoutId,
    room: plan.room ?? room.dimensions,
    listener: plan.listener ?? room.listener,
    limits: plan.limits ?? room.limits ?? undefined,
    sampleRateHz: plan.sampleRateHz ?? room.sampleRateHz,
    channels,
    // The EQ fit keeps to the room's processor as the limit check after it will.
    processorEq: profile?.eq,
  };
  const result = await work.run('planRoom', input);
  return { plan: result, settings: planToTuningSettings(result) };
}

/**
 * Checks one merged channel of a PATCH on its own, so an error names the entry of the request body
 * (`/channels/<bodyIndex>/eq/0/gainDb`) rather than the channel's place in the stored list.
 */
export function checkPatchedChannel(channel: TuningChannel, bodyIndex: number, sampleRateHz: number): void {
  try {
    checkTuningSettings({ sampleRateHz, channels: [channel], subwoofer: null });
  } catch (error) {
    if (error instanceof CalculationInputError && error.field.startsWith('/channels/0')) {
      throw new CalculationInputError(
        error.message,
        `/channels/${bodyIndex}` + error.field.slice('/channels/0'.length),
      );
    }
    throw error;
  }
}
