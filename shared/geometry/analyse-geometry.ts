import { CalculationInputError, requireInRange } from '../errors';
import { requireLayout } from '../layouts';
import { LIMITS } from '../limits';
import type { Layout, LayoutChannel } from '../layouts';
import { angleBetweenDeg, insideAzimuthRange, insideElevationRange, wrapDeg } from './angles';
import { toListenerPolar, type RoomPoint } from './coordinates';

/** Inner dimensions of a rectangular room in metres. */
export interface RoomDimensions {
  widthM: number;
  lengthM: number;
  heightM: number;
}

export interface GeometrySpeakerInput extends RoomPoint {
  /** Channel label (`M+030`, `U-135`, `LFE1`); matched against the layout. */
  id: string;
}

export interface GeometryInput {
  room: RoomDimensions;
  listener: RoomPoint;
  /** Layout id, name or alias; without it only distances and angles are computed. */
  layout?: string;
  speakers: readonly GeometrySpeakerInput[];
  /**
   * Measuring allowance in degrees added to both ends of every permitted range (default 2°). A product
   * choice, not part of the standard: positions taken with a tape and a laser are rarely better than
   * 1–2° at monitoring distances. Set 0 for the strict check.
   */
  angleToleranceDeg?: number;
}

export interface GeometryWarning {
  code:
    | 'azimuthOutOfRange'
    | 'elevationOutOfRange'
    | 'asymmetricPair'
    | 'surroundSpacing'
    | 'unknownChannel'
    | 'missingChannel';
  channel?: string;
  message: string;
}

export interface SpeakerGeometry {
  id: string;
  distanceM: number;
  azimuthDeg: number;
  elevationDeg: number;
  /** The layout's nominal direction, or null without a layout, for an unknown label or an LFE without position. */
  nominal: { azimuthDeg: number; elevationDeg: number } | null;
  /**
   * Actual minus nominal. `azimuthDeg` is null for a loudspeaker whose nominal direction is straight up
   * (azimuth has no meaning there); `angleDeg` is the great-circle angle between the two directions.
   */
  deviation: { azimuthDeg: number | null; elevationDeg: number; angleDeg: number } | null;
  /** The layout's permitted ranges for this channel, or null where there are none. */
  permitted: {
    azimuthRangesDeg: ReadonlyArray<readonly [number, number]>;
    elevationRangeDeg: readonly [number, number];
  } | null;
  /** Inside the permitted ranges (widened by the allowance); null where there is nothing to check. */
  withinTolerance: boolean | null;
}

export interface GeometryResult {
  layout: { id: string; name: string; title: string } | null;
  angleToleranceDeg: number;
  speakers: SpeakerGeometry[];
  warnings: GeometryWarning[];
}

export const GEOMETRY_LIMITS = {
  roomMaxM: LIMITS.widthM.maximum,
  minSpeakerDistanceM: 0.1,
  maxAngleToleranceDeg: LIMITS.angleToleranceDeg.maximum,
  defaultAngleToleranceDeg: LIMITS.angleToleranceDeg.default,
  /** Points this far outside a wall (rounding of tape measurements) still count as inside. */
  wallSlackM: 0.001,
} as const;

function checkRoom(room: RoomDimensions): void {
  for (const key of ['widthM', 'lengthM', 'heightM'] as const) {
    requireInRange(
      room?.[key],
      { min: 0, max: GEOMETRY_LIMITS.roomMaxM, exclusiveMin: true, unit: 'm' },
      key,
      `/room/${key}`,
    );
  }
}

/** Throws unless the point is inside the room (walls included), naming the first coordinate that is not. */
export function requireInsideRoom(point: RoomPoint, room: RoomDimensions, field: string, what: string): void {
  const bounds: Array<[keyof RoomPoint, number, string]> = [
    ['x', room.widthM, 'widthM'],
    ['y', room.lengthM, 'lengthM'],
    ['z', room.heightM, 'heightM'],
  ];
  for (const [axis, size, dimension] of bounds) {
    const value = point?.[axis];
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new CalculationInputError(
        `${what} ${axis} must be a finite number of metres; received ${String(value)}`,
        `${field}/${axis}`,
      );
    }
    if (value < -GEOMETRY_LIMITS.wallSlackM || value > size + GEOMETRY_LIMITS.wallSlackM) {
      throw new CalculationInputError(
        `${what} is outside the room: ${axis} must be between 0 and ${size} m (room ${dimension}); received ${value} m`,
        `${field}/${axis}`,
      );
    }
  }
}

/** Throws on an empty or repeated channel id, naming the offending entry. */
export function requireUniqueIds(items: ReadonlyArray<{ id: string }>, listField: string): void {
  const seen = new Map<string, number>();
  items.forEach((item, index) => {
    if (typeof item?.id !== 'string' || item.id.trim() === '') {
      throw new CalculationInputError('id must be a non-empty channel label', `${listField}/${index}/id`);
    }
    const first = seen.get(item.id);
    if (first !== undefined) {
      throw new CalculationInputError(
        `channel id "${item.id}" appears twice (entries ${first} and ${index}); each loudspeaker needs its own id`,
        `${listField}/${index}/id`,
      );
    }
    seen.set(item.id, index);
  });
}

function judgeChannel(
  polar: { azimuthDeg: number; elevationDeg: number },
  channel: LayoutChannel,
  toleranceDeg: number,
  warnings: GeometryWarning[],
): Pick<SpeakerGeometry, 'nominal' | 'deviation' | 'permitted' | 'withinTolerance'> {
  if (
    channel.azimuthDeg === null ||
    channel.elevationDeg === null ||
    !channel.azimuthRangesDeg ||
    !channel.elevationRangeDeg
  ) {
    return { nominal: null, deviation: null, permitted: null, withinTolerance: null };
  }
  const nominal = { azimuthDeg: channel.azimuthDeg, elevationDeg: channel.elevationDeg };
  const zenith = Math.abs(channel.elevationDeg) === 90;
  const azimuthOk =
    zenith ||
    channel.azimuthRangesDeg.some((range) => insideAzimuthRange(polar.azimuthDeg, range, toleranceDeg));
  const elevationOk = insideElevationRange(polar.elevationDeg, channel.elevationRangeDeg, toleranceDeg);
  // Angles in words take a true minus sign (U+2212), as the layout notes do, never a hyphen.
  const deg = (v: number) => `${v < 0 ? '\u2212' : ''}${Math.abs(v)}`;
  const fmt = (v: number) => {
    const text = Math.abs(v).toFixed(1);
    return Number(text) === 0 || v > 0 ? text : `\u2212${text}`;
  };
  if (!azimuthOk) {
    const ranges = channel.azimuthRangesDeg
      .map(([a, b]) => (a === b ? `${deg(a)}°` : `${deg(a)}°..${deg(b)}°`))
      .join(' or ');
    warnings.push({
      code: 'azimuthOutOfRange',
      channel: channel.label,
      message: `${channel.label} is at azimuth ${fmt(polar.azimuthDeg)}°; the layout permits ${ranges} (±${toleranceDeg}° allowance).`,
    });
  }
  if (!elevationOk) {
    const [a, b] = channel.elevationRangeDeg;
    warnings.push({
      code: 'elevationOutOfRange',
      channel: channel.label,
      message: `${channel.label} is at elevation ${fmt(polar.elevationDeg)}°; the layout permits ${a === b ? `${deg(a)}°` : `${deg(a)}°..${deg(b)}°`} (±${toleranceDeg}° allowance).`,
    });
  }
  return {
    nominal,
    deviation: {
      azimuthDeg: zenith ? null : wrapDeg(polar.azimuthDeg - nominal.azimuthDeg),
      elevationDeg: polar.elevationDeg - nominal.elevationDeg,
      angleDeg: angleBetweenDeg(polar, nominal),
    },
    permitted: { azimuthRangesDeg: channel.azimuthRangesDeg, elevationRangeDeg: channel.elevationRangeDeg },
    withinTolerance: azimuthOk && elevationOk,
  };
}

function checkPairRules(
  layout: Layout,
  byLabel: ReadonlyMap<string, SpeakerGeometry>,
  warnings: GeometryWarning[],
): void {
  const { symmetryAboveAzimuthDeg, symmetryToleranceDeg, sideSurroundSpacingDeg } = layout.rules;
  for (const channel of layout.channels) {
    if (channel.isLfe || channel.azimuthDeg === null || !channel.label.includes('+')) continue;
    const nominal = Math.abs(channel.azimuthDeg);
    if (nominal <= symmetryAboveAzimuthDeg || nominal === 180) continue;
    const partnerLabel = channel.label.replace('+', '-');
    const left = byLabel.get(channel.label);
    const right = byLabel.get(partnerLabel);
    if (!left || !right) continue;
    const mismatch = Math.abs(wrapDeg(left.azimuthDeg + right.azimuthDeg));
    if (mismatch > symmetryToleranceDeg) {
      warnings.push({
        code: 'asymmetricPair',
        channel: channel.label,
        message: `${channel.label} (${left.azimuthDeg.toFixed(1)}°) and ${partnerLabel} (${right.azimuthDeg.toFixed(1)}°) differ by ${mismatch.toFixed(1)}° from mirror symmetry; BS.2051 asks for pairs beyond ±${symmetryAboveAzimuthDeg}° to be symmetric within ${symmetryToleranceDeg}°.`,
      });
    }
  }
  if (!sideSurroundSpacingDeg) return;
  for (const [side, sign] of [
    ['left', '+'],
    ['right', '-'],
  ] as const) {
    const sideSpeaker = byLabel.get(`M${sign}090`);
    const rearSpeaker = byLabel.get(`M${sign}135`);
    if (!sideSpeaker || !rearSpeaker) continue;
    const spacing = Math.abs(wrapDeg(rearSpeaker.azimuthDeg - sideSpeaker.azimuthDeg));
    const [min, max] = sideSurroundSpacingDeg;
    if (spacing < min || spacing > max) {
      warnings.push({
        code: 'surroundSpacing',
        channel: `M${sign}135`,
        message: `The ${side} middle-layer surrounds M${sign}090 and M${sign}135 are ${spacing.toFixed(1)}° apart; BS.2051 system ${layout.system} asks for ${min}°..${max}°.`,
      });
    }
  }
}

/**
 * Distance, azimuth and elevation of every loudspeaker seen from the listening position, and, with a
 * layout, the deviation from nominal and the ITU-R BS.2051-3 placement rules: permitted ranges per
 * loudspeaker, symmetry of pairs beyond ±45° within 10°, and in systems G, I and J 30°..60° between the
 * two middle-layer surrounds on one side (ITU-R BS.2051-3).
 *
 * Throws CalculationInputError for a room dimension out of (0, 100] m, a listener or loudspeaker outside
 * the room, a repeated channel id, a loudspeaker closer than 0.1 m to the listener, an unknown layout.
 */
export function analyseGeometry(input: GeometryInput): GeometryResult {
  checkRoom(input.room);
  requireInsideRoom(input.listener, input.room, '/listener', 'the listening position');
  const toleranceDeg =
    input.angleToleranceDeg === undefined
      ? GEOMETRY_LIMITS.defaultAngleToleranceDeg
      : requireInRange(
          input.angleToleranceDeg,
          { min: 0, max: GEOMETRY_LIMITS.maxAngleToleranceDeg, unit: '°' },
          'angleToleranceDeg',
          '/angleToleranceDeg',
        );
  const layout = input.layout === undefined ? null : requireLayout(input.layout, '/layout');
  requireUniqueIds(input.speakers, '/speakers');

  const warnings: GeometryWarning[] = [];
  const speakers = input.speakers.map((speaker, index): SpeakerGeometry => {
    requireInsideRoom(speaker, input.room, `/speakers/${index}`, `loudspeaker ${speaker.id}`);
    const polar = toListenerPolar(input.listener, speaker);
    if (polar.distanceM < GEOMETRY_LIMITS.minSpeakerDistanceM) {
      throw new CalculationInputError(
        `loudspeaker ${speaker.id} is ${polar.distanceM.toFixed(3)} m from the listening position; it must be at least ${GEOMETRY_LIMITS.minSpeakerDistanceM} m away`,
        `/speakers/${index}`,
      );
    }
    const channel = layout?.channels.find((c) => c.label === speaker.id);
    if (layout && !channel) {
      warnings.push({
        code: 'unknownChannel',
        channel: speaker.id,
        message: `${speaker.id} is not a loudspeaker of layout ${layout.name}; its angles are reported without a check.`,
      });
    }
    const judged = channel
      ? judgeChannel(polar, channel, toleranceDeg, warnings)
      : { nominal: null, deviation: null, permitted: null, withinTolerance: null };
    return { id: speaker.id, ...polar, ...judged };
  });

  if (layout) {
    const byLabel = new Map(speakers.map((s) => [s.id, s]));
    for (const channel of layout.channels) {
      if (!byLabel.has(channel.label)) {
        warnings.push({
          code: 'missingChannel',
          channel: channel.label,
          message: `Layout ${layout.name} has ${channel.label}, which is not among the loudspeakers given.`,
        });
      }
    }
    checkPairRules(layout, byLabel, warnings);
  }

  return {
    layout: layout && { id: layout.id, name: layout.name, title: layout.title },
    angleToleranceDeg: toleranceDeg,
    speakers,
    warnings,
  };
}
