import type { ProcessorProfileSettings } from '../processor/profile';
import type { RoomLimits } from './tuning-limits';

interface Point {
  x: number;
  y: number;
  z: number;
}

/**
 * What a tuning depends on in its room: where the listener and the loudspeakers are, the room's limits,
 * its sample rate and its processor profile (which one, and what it says). A tuning made from one state
 * is stale once the room's state differs from it. Names, notes and the room's dimensions are not part
 * of it: changing them does not change any setting.
 */
export interface RoomState {
  listener: Point;
  loudspeakers: Array<Point & { id: string }>;
  limits: RoomLimits | null;
  sampleRateHz: number;
  profile: { id: string; name: string; settings: ProcessorProfileSettings } | null;
}

/** Movements below this are not a change (float noise of an unchanged number), metres. */
const MOVED_M = 0.0005;

const distance = (a: Point, b: Point): number => Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);
const metres = (m: number): string => `${m.toFixed(2)} m`;
const same = (a: unknown, b: unknown): boolean => JSON.stringify(a) === JSON.stringify(b);
const show = (value: number | undefined): string => (value === undefined ? 'none' : String(value));

/**
 * What changed between the room state a tuning was made from and the room now, as sentences a person
 * reads ("listener moved 0.80 m", "M+030 moved 0.25 m", "limits changed: trimMaxDb 12 → 6",
 * "sample rate changed from 48000 Hz to 96000 Hz", "processor profile changed from none to "8-band
 * generic""). Empty when nothing a tuning depends on changed.
 */
export function roomStateChanges(before: RoomState, now: RoomState): string[] {
  const reasons: string[] = [];
  const moved = distance(before.listener, now.listener);
  if (moved > MOVED_M) reasons.push(`listener moved ${metres(moved)}`);
  const was = new Map(before.loudspeakers.map((s) => [s.id, s]));
  const is = new Map(now.loudspeakers.map((s) => [s.id, s]));
  for (const [id, speaker] of is) {
    const old = was.get(id);
    if (!old) reasons.push(`loudspeaker ${id} added`);
    else if (distance(old, speaker) > MOVED_M) reasons.push(`${id} moved ${metres(distance(old, speaker))}`);
  }
  for (const id of was.keys()) if (!is.has(id)) reasons.push(`loudspeaker ${id} removed`);
  if (!same(before.limits ?? {}, now.limits ?? {})) {
    const a = (before.limits ?? {}) as Record<string, number | undefined>;
    const b = (now.limits ?? {}) as Record<string, number | undefined>;
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].filter((k) => a[k] !== b[k]).sort();
    reasons.push(`limits changed: ${keys.map((k) => `${k} ${show(a[k])} → ${show(b[k])}`).join(', ')}`);
  }
  if (before.sampleRateHz !== now.sampleRateHz) {
    reasons.push(`sample rate changed from ${before.sampleRateHz} Hz to ${now.sampleRateHz} Hz`);
  }
  const p0 = before.profile;
  const p1 = now.profile;
  if ((p0?.id ?? null) !== (p1?.id ?? null)) {
    const name = (p: RoomState['profile']) => (p ? `"${p.name}"` : 'none');
    reasons.push(`processor profile changed from ${name(p0)} to ${name(p1)}`);
  } else if (p0 && p1 && !same(p0.settings, p1.settings)) {
    reasons.push(`processor profile "${p1.name}" was edited`);
  }
  return reasons;
}
