import { CalculationInputError, requireInRange } from '../errors';
import { LIMITS } from '../limits';

export interface RoomDimensions {
  /** Along x (left to right seen from the listening position), metres. */
  widthM: number;
  /** Along y (front wall to back wall), metres. */
  lengthM: number;
  /** Along z (floor to ceiling), metres. */
  heightM: number;
}

export type ModeKind = 'axial' | 'tangential' | 'oblique';

export interface RoomMode {
  /** Half-wavelength counts across the width, length and height. */
  nx: number;
  ny: number;
  nz: number;
  frequencyHz: number;
  kind: ModeKind;
}

export interface RoomModesResult {
  modes: RoomMode[];
  /** True when more modes lay below `maxFrequencyHz` than `maxModes` allowed. */
  truncated: boolean;
  /** How many modes lie at or below `maxFrequencyHz` (more than listed when truncated). */
  found: number;
}

/** Highest frequency a mode list may reach: the Schroeder frequency of a 0.5 m cube with T60 = 20 s is 25.3 kHz. */
export const MAX_MODE_FREQUENCY_HZ = 30000;
/** The contract's room sides (`roomWidthM`, `roomLengthM`, `roomHeightM` share one range). */
const ROOM_SIDE_M = LIMITS.roomWidthM;

function requireDimensions(room: RoomDimensions): void {
  for (const key of ['widthM', 'lengthM', 'heightM'] as const) {
    requireInRange(
      room[key],
      { min: ROOM_SIDE_M.minimum, max: ROOM_SIDE_M.maximum, unit: 'm' },
      key,
      `/${key}`,
    );
  }
}

/**
 * Natural frequencies of a rigid-walled rectangular room,
 * `f = (c/2)·sqrt((nx/Lx)² + (ny/Ly)² + (nz/Lz)²)`; one non-zero index is an axial mode, two tangential,
 * three oblique (Kuttruff, *Room Acoustics*; as in the pyrato library [lib]).
 *
 * @param room inside dimensions in metres (each within the contract's `roomWidthM`).
 * @param speedOfSoundMps speed of sound, m/s (within the contract's `speedOfSoundMps`).
 * @param maxFrequencyHz highest mode to list, hertz (above 0, at most 30 kHz; the number of candidates
 *   grows with (maxFrequencyHz)³·volume, which the Schroeder frequency keeps small: see roomSummary).
 * @param maxModes most modes to return, lowest first (1..5000).
 * @returns modes in ascending frequency (ties by nx, ny, nz).
 */
export function roomModes(
  room: RoomDimensions,
  speedOfSoundMps: number,
  maxFrequencyHz: number,
  maxModes = 500,
): RoomModesResult {
  requireDimensions(room);
  requireInRange(
    speedOfSoundMps,
    { min: LIMITS.speedOfSoundMps.minimum, max: LIMITS.speedOfSoundMps.maximum, unit: 'm/s' },
    'speedOfSoundMps',
    '/speedOfSoundMps',
  );
  requireInRange(
    maxFrequencyHz,
    { min: 0, exclusiveMin: true, max: MAX_MODE_FREQUENCY_HZ, unit: 'Hz' },
    'maxFrequencyHz',
    '/maxFrequencyHz',
  );
  requireInRange(maxModes, { min: 1, max: 5000 }, 'maxModes', '/maxModes');
  const half = speedOfSoundMps / 2;
  const limit = (dimensionM: number) => Math.floor((maxFrequencyHz * dimensionM) / half);
  const modes: RoomMode[] = [];
  for (let nx = 0; nx <= limit(room.widthM); nx++) {
    for (let ny = 0; ny <= limit(room.lengthM); ny++) {
      for (let nz = 0; nz <= limit(room.heightM); nz++) {
        const nonZero = (nx > 0 ? 1 : 0) + (ny > 0 ? 1 : 0) + (nz > 0 ? 1 : 0);
        if (nonZero === 0) continue;
        const frequencyHz =
          half * Math.sqrt((nx / room.widthM) ** 2 + (ny / room.lengthM) ** 2 + (nz / room.heightM) ** 2);
        if (frequencyHz > maxFrequencyHz) continue;
        const kind: ModeKind = nonZero === 1 ? 'axial' : nonZero === 2 ? 'tangential' : 'oblique';
        modes.push({ nx, ny, nz, frequencyHz, kind });
      }
    }
  }
  modes.sort((a, b) => a.frequencyHz - b.frequencyHz || a.nx - b.nx || a.ny - b.ny || a.nz - b.nz);
  return { modes: modes.slice(0, maxModes), truncated: modes.length > maxModes, found: modes.length };
}

/** Room volume in cubic metres. */
export function roomVolumeM3(room: RoomDimensions): number {
  requireDimensions(room);
  return room.widthM * room.lengthM * room.heightM;
}

/**
 * Schroeder frequency `fS = 2000·sqrt(T60/V)` (T60 in s, V in m³), above which modes overlap enough to
 * treat the field statistically (Kuttruff, *Room Acoustics* [lib]).
 * @param reverberationTimeS T60 in seconds (0.01..20).
 * @param volumeM3 room volume in cubic metres (> 0).
 */
export function schroederFrequencyHz(reverberationTimeS: number, volumeM3: number): number {
  requireInRange(
    reverberationTimeS,
    { min: 0.01, max: 20, unit: 's' },
    'reverberationTimeS',
    '/reverberationTimeS',
  );
  if (!(volumeM3 > 0))
    throw new CalculationInputError(`volumeM3 must be above 0; received ${volumeM3}`, '/volumeM3');
  return 2000 * Math.sqrt(reverberationTimeS / volumeM3);
}
