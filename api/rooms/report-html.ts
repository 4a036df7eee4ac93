const ENTITIES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Escapes text for HTML element content and attribute values (every user-supplied string goes through it). */
export function esc(value: unknown): string {
  return String(value ?? '').replace(/[&<>"']/g, (c) => ENTITIES[c]);
}

/** A number with a fixed count of decimals and a real minus sign; an em dash for null. */
export function num(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = Math.abs(value).toFixed(digits);
  return (value < 0 && Number(text) !== 0 ? '−' : '') + text;
}

/** A signed number (+1.2 / −3.4 / 0.0). */
export function signed(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return value > 0 && Number(value.toFixed(digits)) !== 0 ? '+' + value.toFixed(digits) : num(value, digits);
}

/**
 * A coordinate for an SVG attribute: one decimal and an ASCII hyphen-minus, as the SVG number grammar
 * requires (the typographic minus of `num` is for text people read, and makes `x2="−100.5"` invalid).
 */
export function coord(value: number): string {
  const text = value.toFixed(1);
  return text === '-0.0' ? '0.0' : text;
}
