import type { Layout, RoomCreate } from './room.model';

/** The form path of the field an API pointer names (`/body/loudspeakers/3/x` → loudspeakers.3.x). */
export function formPathOf(pointer: string): string[] | null {
  if (!pointer.startsWith('/body/')) return null;
  const parts = pointer.slice('/body/'.length).split('/').filter(Boolean);
  return parts.length ? parts : null;
}

/** "4+7+0 · 7.1.4 (system J)": what a person recognises a layout by. */
export function layoutLabel(layout: Pick<Layout, 'name' | 'aliases' | 'system'>): string {
  const aliases = layout.aliases.length ? ` · ${layout.aliases.join(', ')}` : '';
  const system = layout.system ? ` (system ${layout.system})` : '';
  return `${layout.name}${aliases}${system}`;
}

export interface LimitsFormValue {
  delayMaxMs: number | null;
  trimMinDb: number | null;
  trimMaxDb: number | null;
  eqBandsPerChannel: number | null;
  eqMaxBoostDb: number | null;
  eqMaxCutDb: number | null;
}

/** The limits a person filled in; empty fields are limits the processor does not have. */
export function limitsOf(value: LimitsFormValue): NonNullable<RoomCreate['limits']> | undefined {
  const entries = Object.entries(value).filter(
    (entry): entry is [string, number] =>
      entry[1] !== null && String(entry[1]) !== '' && Number.isFinite(Number(entry[1])),
  );
  return entries.length ? Object.fromEntries(entries.map(([key, v]) => [key, Number(v)])) : undefined;
}

/** Rounds metres to the millimetre the form shows. */
export const mm = (value: number): number => Math.round(value * 1000) / 1000;
