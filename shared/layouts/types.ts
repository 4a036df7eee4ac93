/** Layer of a loudspeaker, from the prefix of its ITU-R BS.2051 label. */
export type LayoutLayer = 'middle' | 'upper' | 'upperHigh' | 'top' | 'bottom' | 'lfe';

/** An angular interval in degrees, `[min, max]`; for azimuth it runs anticlockwise (leftward) from min to max. */
export type AngleRangeDeg = readonly [number, number];

/** One loudspeaker (channel) of a standard layout. */
export interface LayoutChannel {
  /** ITU-R BS.2051 label such as `M+030`, `U-135`, `LFE1`. */
  label: string;
  layer: LayoutLayer;
  isLfe: boolean;
  /** Nominal azimuth in degrees, positive to the left; null where the standard gives no position (most LFE channels). */
  azimuthDeg: number | null;
  /** Nominal elevation in degrees, positive upward; null where the standard gives no position. */
  elevationDeg: number | null;
  /**
   * Permitted azimuth intervals. A single value in the standard's table is stored as `[v, v]`. More than
   * one interval only for the screen loudspeakers M±SC of system G.
   */
  azimuthRangesDeg: readonly AngleRangeDeg[] | null;
  /** Permitted elevation interval; `[v, v]` where the table gives a single value. */
  elevationRangeDeg: AngleRangeDeg | null;
  /** Anything a reader must know about this row (e.g. a nominal value the standard leaves open). */
  note?: string;
}

/** Placement rules a layout's checks apply besides the per-loudspeaker ranges. */
export interface LayoutRules {
  /** Left/right pairs with |nominal azimuth| above this many degrees must be symmetric (BS.2051). */
  symmetryAboveAzimuthDeg: number;
  /** Largest allowed difference of |azimuth| between the two loudspeakers of such a pair, degrees. */
  symmetryToleranceDeg: number;
  /** Where set: the angle between the two middle-layer surrounds on one side must lie in this interval. */
  sideSurroundSpacingDeg: AngleRangeDeg | null;
}

/** A standard loudspeaker layout. */
export interface Layout {
  /** Stable identifier used in URLs and stored rooms, e.g. `bs2051-j`. */
  id: string;
  /** BS.2051 system letter, or null for a layout that is not a BS.2051 system (9.1.6). */
  system: string | null;
  /** Upper+Middle+Bottom loudspeaker count, LFE not counted, e.g. `4+7+0`. */
  name: string;
  /** Trade names that select this layout, e.g. `7.1.4`. */
  aliases: readonly string[];
  title: string;
  /** Where the table comes from. */
  reference: string;
  channels: readonly LayoutChannel[];
  rules: LayoutRules;
  notes: readonly string[];
}
