import type { Sos } from '../dsp/sos';
import { designBiquads } from '../filters/biquad-design';
import { designCrossover, type Polarity } from '../filters/crossover';
import { withFieldPrefix } from '../errors';
import { requireSampleRate } from '../units/sample-rate';
import type { TuningSettings } from './tuning';

export interface DesignedSection extends Sos {
  /** Which stage of the channel the section belongs to. */
  stage: 'eq' | 'highPass' | 'lowPass';
}

export interface DesignedChannel {
  id: string;
  delayMs: number;
  /** delayMs in whole samples at the export rate (nearest sample). */
  delaySamples: number;
  trimDb: number;
  polarity: Polarity;
  /** EQ sections in order, then the high-pass (bass-managed channels) or the low-pass (the subwoofer). */
  sections: DesignedSection[];
}

export interface DesignedTuning {
  sampleRateHz: number;
  channels: DesignedChannel[];
  subwoofer: { channel: string; lfeGainDb: number; headroomDb: number | null } | null;
}

/**
 * Designs every section of a tuning at `sampleRateHz` from the stored parameters: EQ with designBiquad
 * (Audio EQ Cookbook), crossovers with designCrossover. Nothing is resampled, so the coefficients at
 * 44.1, 48 or 96 kHz are exactly what POST /v1/biquads and POST /v1/crossovers give for the same
 * parameters at that rate. Sections are normalised a0 = 1:
 * H(z) = (b0 + b1 z⁻¹ + b2 z⁻²) / (1 + a1 z⁻¹ + a2 z⁻²).
 * @throws CalculationInputError when a stored filter cannot be realised at this rate (e.g. above Nyquist),
 *   naming `/channels/i/eq/j/frequencyHz`.
 */
export function designTuning(settings: TuningSettings, sampleRateHz: number): DesignedTuning {
  const fs = requireSampleRate(sampleRateHz);
  const sub = settings.subwoofer;
  return {
    sampleRateHz: fs,
    channels: settings.channels.map((channel, i) => {
      const eq = designBiquads(channel.eq, fs, `/channels/${i}/eq`).map((s) => ({
        ...s,
        stage: 'eq' as const,
      }));
      const highPassSpec = channel.highPass;
      const highPass = highPassSpec
        ? withFieldPrefix(`/channels/${i}/highPass`, () =>
            designCrossover(highPassSpec, fs),
          ).highPass.sections.map((s) => ({ ...s, stage: 'highPass' as const }))
        : [];
      const lowPassSpec = sub && sub.channel === channel.id ? sub.lowPass : null;
      const lowPass = lowPassSpec
        ? withFieldPrefix('/subwoofer/lowPass', () => designCrossover(lowPassSpec, fs)).lowPass.sections.map(
            (s) => ({
              ...s,
              stage: 'lowPass' as const,
            }),
          )
        : [];
      return {
        id: channel.id,
        delayMs: channel.delayMs,
        delaySamples: Math.round((channel.delayMs * fs) / 1000),
        trimDb: channel.trimDb,
        polarity: channel.polarity,
        sections: [...eq, ...highPass, ...lowPass],
      };
    }),
    subwoofer: sub
      ? { channel: sub.channel, lfeGainDb: sub.lfeGainDb, headroomDb: sub.headroomDb ?? null }
      : null,
  };
}
