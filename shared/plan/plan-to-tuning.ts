import type { RoomPlan } from './plan-room';
import type { TuningSettings } from './tuning';

/**
 * The settings a plan asks for, as a tuning stores them: filters as parameters (EQ bands, crossover
 * family/order/frequency), never coefficients, so they can be re-designed at any sample rate. The
 * subwoofer output takes the plan's suggested delay and polarity (aligned at the crossover).
 */
export function planToTuningSettings(plan: RoomPlan): TuningSettings {
  const sub = plan.subwoofer;
  return {
    sampleRateHz: plan.sampleRateHz,
    channels: plan.channels.map((c) => {
      const isSub = sub !== null && sub.channel === c.id;
      return {
        id: c.id,
        delayMs: isSub ? sub.suggestedDelayMs : c.delayMs,
        trimDb: c.trimDb,
        polarity: isSub ? sub.suggestedPolarity : c.polarity,
        eq: c.eq.bands.map((b) => ({ type: b.type, frequencyHz: b.frequencyHz, gainDb: b.gainDb, q: b.q })),
        highPass: c.highPass && {
          family: c.highPass.family,
          order: c.highPass.order,
          frequencyHz: c.highPass.frequencyHz,
        },
        bassManaged: c.role === 'managed',
      };
    }),
    subwoofer:
      sub && sub.channel
        ? {
            channel: sub.channel,
            lowPass: plan.channels.some((c) => c.role === 'managed')
              ? { family: sub.lowPass.family, order: sub.lowPass.order, frequencyHz: sub.lowPass.frequencyHz }
              : null,
            lfeGainDb: sub.lfeGainDb,
            headroomDb: sub.headroomDb,
          }
        : null,
  };
}
