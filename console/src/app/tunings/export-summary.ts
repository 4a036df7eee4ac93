import type { components } from '../../../../shared/contract/api-types';
import { formatQuantity } from '../format/format';
import { formatFrequency } from '../ui/chart/frequency-ticks';

export type TuningExport = components['schemas']['TuningExport'];

/**
 * Rounding that changes the EQ by more than this is worth a look before loading the processor; the API's
 * own export caution uses the same figure.
 */
export const ROUNDING_NOTICE_DB = 0.5;

/** One channel of the export, as the dialog's table lists it. */
export interface ExportRow {
  channel: string;
  delay: string;
  trim: string;
  bands: number;
  /** Largest deviation of the exported EQ from the stored one, e.g. "0.48 dB at 45.6 Hz" or "none". */
  rounding: string;
  roundingDb: number;
  /** Whether the deviation passes {@link ROUNDING_NOTICE_DB}. */
  notable: boolean;
}

export interface ExportSummary {
  rows: ExportRow[];
  /** The one sentence the dialog leads with: the worst channel, or that rounding cost nothing. */
  headline: string;
  notableCount: number;
}

type ExportChannel = TuningExport['channels'][number];

/** The parts of an export the summary reads, in the contract's types: any `TuningExport` is one. */
export interface ExportSummaryInput {
  header: { profile: Pick<NonNullable<TuningExport['header']['profile']>, 'name'> | null };
  channels: ReadonlyArray<
    Pick<ExportChannel, 'id' | 'delayMs' | 'delaySamples' | 'trimDb' | 'eqRounding'> & {
      eq: readonly unknown[];
    }
  >;
}

/** What the export's rounding cost, per channel and in one sentence. */
export function exportSummary(exported: ExportSummaryInput): ExportSummary {
  const rows = exported.channels.map((channel): ExportRow => {
    const { maxDeviationDb, atHz } = channel.eqRounding;
    return {
      channel: channel.id,
      delay: `${formatQuantity(channel.delayMs, 'ms', 3)} (${formatSamples(channel.delaySamples)} samples)`,
      trim: formatQuantity(channel.trimDb, 'dB', 2),
      bands: channel.eq.length,
      rounding:
        channel.eq.length === 0
          ? 'no EQ'
          : maxDeviationDb < 0.005
            ? 'under 0.01 dB'
            : `${formatQuantity(maxDeviationDb, 'dB', 2)}${atHz ? ` at ${formatFrequency(atHz)} Hz` : ''}`,
      roundingDb: maxDeviationDb,
      notable: maxDeviationDb > ROUNDING_NOTICE_DB,
    };
  });
  const worst = exported.channels.reduce<(typeof exported.channels)[number] | null>(
    (w, c) => (!w || c.eqRounding.maxDeviationDb > w.eqRounding.maxDeviationDb ? c : w),
    null,
  );
  const notableCount = rows.filter((r) => r.notable).length;
  const profile = exported.header.profile?.name ?? 'exact values (no processor profile)';
  let headline: string;
  if (!worst || worst.eqRounding.maxDeviationDb < 0.005)
    headline = `Rounding to ${profile} changes no channel’s EQ by 0.01 dB or more.`;
  else {
    const where = worst.eqRounding.atHz ? ` at ${formatFrequency(worst.eqRounding.atHz)} Hz` : '';
    const rest = notableCount
      ? `${notableCount} channel${notableCount === 1 ? '' : 's'} by more than ${ROUNDING_NOTICE_DB} dB.`
      : `every channel within ${ROUNDING_NOTICE_DB} dB.`;
    headline = `Rounding to ${profile} changes the EQ by at most ${formatQuantity(worst.eqRounding.maxDeviationDb, 'dB', 2)} (${worst.id}${where}); ${rest}`;
  }
  return { rows, headline, notableCount };
}

/** Samples as the processor takes them: whole when whole, else to two places. */
function formatSamples(samples: number): string {
  return Number.isInteger(samples) ? String(samples) : samples.toFixed(2);
}
