const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
const DAY_MS = 24 * HOUR_MS;

function parse(value: string | Date | null | undefined): Date | null {
  if (value === null || value === undefined || value === '') return null;
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "2026-03-14 09:30" in the given time zone (the browser's when absent); "—" for no date. */
export function formatDateTime(value: string | Date | null | undefined, timeZone?: string): string {
  const date = parse(value);
  if (!date) return '—';
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(date);
  const get = (type: Intl.DateTimeFormatPartTypes) => parts.find((part) => part.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')} ${get('hour')}:${get('minute')}`;
}

/** "2026-03-14" in the given time zone (the browser's when absent). */
export function formatDate(value: string | Date | null | undefined, timeZone?: string): string {
  const text = formatDateTime(value, timeZone);
  return text === '—' ? text : text.slice(0, 10);
}

/** "just now", "5 min ago", "3 h ago", "2 days ago", "in 4 days"; `never` for no date. */
export function formatRelative(value: string | Date | null | undefined, now: Date, never = 'never'): string {
  const date = parse(value);
  if (!date) return never;
  const deltaMs = date.getTime() - now.getTime();
  const future = deltaMs > 0;
  const size = Math.abs(deltaMs);
  let text: string;
  if (size < MINUTE_MS) return 'just now';
  if (size < HOUR_MS) text = `${Math.floor(size / MINUTE_MS)} min`;
  else if (size < DAY_MS) text = `${Math.floor(size / HOUR_MS)} h`;
  else {
    const days = Math.floor(size / DAY_MS);
    text = `${days} ${days === 1 ? 'day' : 'days'}`;
  }
  return future ? `in ${text}` : `${text} ago`;
}

/** Whole numbers with thin grouping: 12 345. */
export function formatCount(value: number): string {
  if (!Number.isFinite(value)) return '—';
  return new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(value).replace(/,/g, '\u202f');
}

/** A ratio as a percentage with one decimal: 0.0123 → "1.2 %"; "—" when there is nothing to divide. */
export function formatPercent(ratio: number): string {
  if (!Number.isFinite(ratio)) return '—';
  return `${(ratio * 100).toFixed(1)}\u00a0%`;
}

/** A signed difference with its unit: "+1.50 dB", "−0.20 ms" (true minus sign), "0.00 ms"; "—" for none. */
export function formatSigned(value: number | null | undefined, unit: string, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const rounded = Number(value.toFixed(digits));
  const text = Math.abs(rounded).toFixed(digits);
  const sign = rounded > 0 ? '+' : rounded < 0 ? '\u2212' : '';
  return `${sign}${text}\u00a0${unit}`;
}

/** A plain quantity with its unit: "3.25 m", "30.0°". */
export function formatQuantity(value: number | null | undefined, unit: string, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toFixed(digits).replace('-', '\u2212');
  return unit === '°' ? `${text}°` : `${text}\u00a0${unit}`;
}
