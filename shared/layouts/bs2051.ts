import type { AngleRangeDeg, Layout, LayoutChannel, LayoutLayer, LayoutRules } from './types';

/*
 * ITU-R BS.2051-3 (05/2022), "Advanced sound system for programme production", loudspeaker
 * configurations for sound systems A–J.
 *
 * Provenance of the numbers below:
 * - Nominal azimuth/elevation and permitted ranges were transcribed from the open data file of the
 *   EBU ADM renderer (github.com/ebu/ebu_adm_renderer, ear/core/data/2051_layouts.yaml), which encodes
 *   the standard's per-system tables, and checked against the published excerpts of ITU-R BS.2051-3 (system J:
 *   M±090 at ±85..±110°, U±045 at ±30..±45° azimuth and +30..+55° elevation). That file states it was
 *   derived from BS.2051-1; the values were not re-read in the -3 text itself.
 * - Table numbers: in BS.2051 one table per system follows the overview; the numbering used here
 *   (system A = Table 2 … system J = Table 11) is from memory.
 * - Where the table gives a single value rather than a range, the range is stored as [v, v].
 * - LFE channels have no position in the standard except in systems F and H, where the tables give a
 *   lower-front region for LFE1/LFE2.
 */

const BS2051 = 'ITU-R BS.2051-3';

/** The symmetry rule applies to every system: pairs beyond ±45° symmetric within 10° (ITU-R BS.2051-3). */
const COMMON_RULES: LayoutRules = {
  symmetryAboveAzimuthDeg: 45,
  symmetryToleranceDeg: 10,
  sideSurroundSpacingDeg: null,
};

/** Systems G, I and J also bound the angle between the two middle-layer surrounds on one side. */
const SURROUND_SPACING_RULES: LayoutRules = { ...COMMON_RULES, sideSurroundSpacingDeg: [30, 60] };

function layerOf(label: string): LayoutLayer {
  if (label.startsWith('LFE')) return 'lfe';
  if (label.startsWith('UH')) return 'upperHigh';
  if (label.startsWith('U')) return 'upper';
  if (label.startsWith('T')) return 'top';
  if (label.startsWith('B')) return 'bottom';
  return 'middle';
}

function ch(
  label: string,
  azimuthDeg: number,
  elevationDeg: number,
  azimuthRange?: AngleRangeDeg,
  elevationRange?: AngleRangeDeg,
  note?: string,
): LayoutChannel {
  return {
    label,
    layer: layerOf(label),
    isLfe: false,
    azimuthDeg,
    elevationDeg,
    azimuthRangesDeg: [azimuthRange ?? [azimuthDeg, azimuthDeg]],
    elevationRangeDeg: elevationRange ?? [elevationDeg, elevationDeg],
    ...(note !== undefined && { note }),
  };
}

/** An LFE channel without a position requirement (systems B, C, D, E, G, I, J). */
function lfe(label: string): LayoutChannel {
  return {
    label,
    layer: 'lfe',
    isLfe: true,
    azimuthDeg: null,
    elevationDeg: null,
    azimuthRangesDeg: null,
    elevationRangeDeg: null,
    note: 'The standard gives no position for this LFE channel; place the subwoofer for the smoothest bass.',
  };
}

/** An LFE channel with the lower-front region of systems F and H. */
function lfeAt(label: string, azimuthDeg: number, azimuthRange: AngleRangeDeg): LayoutChannel {
  return {
    label,
    layer: 'lfe',
    isLfe: true,
    azimuthDeg,
    elevationDeg: -30,
    azimuthRangesDeg: [azimuthRange],
    elevationRangeDeg: [-30, -15],
  };
}

const LFE_NOTE =
  'LFE channels carry a −10 dB recording offset, so they are replayed with +10 dB in-band gain (BS.2051-3 Table 1 note 5; details in ITU-R BS.775).';
const TIME_ALIGN_NOTE =
  'Loudspeakers not on a sphere around the listening position should be time-aligned there to within 100 µs (BS.2051-3 Table 1 note 1).';

const FRONT_PAIR_FIXED = [ch('M+030', 30, 0), ch('M-030', -30, 0), ch('M+000', 0, 0)];
const FRONT_PAIR_WIDE = [ch('M+030', 30, 0, [30, 45]), ch('M-030', -30, 0, [-45, -30]), ch('M+000', 0, 0)];
const SURROUND_110_ELEVATED = [
  ch('M+110', 110, 0, [100, 120], [0, 15]),
  ch('M-110', -110, 0, [-120, -100], [0, 15]),
];
const SURROUND_110 = [ch('M+110', 110, 0, [100, 120]), ch('M-110', -110, 0, [-120, -100])];
const UPPER_030 = [ch('U+030', 30, 30, [30, 45], [30, 55]), ch('U-030', -30, 30, [-45, -30], [30, 55])];
const UPPER_110 = [ch('U+110', 110, 30, [100, 135], [30, 55]), ch('U-110', -110, 30, [-135, -100], [30, 55])];
const SIDE_REAR_SURROUNDS = [
  ch('M+090', 90, 0, [85, 110]),
  ch('M-090', -90, 0, [-110, -85]),
  ch('M+135', 135, 0, [120, 150]),
  ch('M-135', -135, 0, [-150, -120]),
];
const UPPER_045_135 = [
  ch('U+045', 45, 30, [30, 45], [30, 55]),
  ch('U-045', -45, 30, [-45, -30], [30, 55]),
  ch('U+135', 135, 30, [100, 150], [30, 55]),
  ch('U-135', -135, 30, [-150, -100], [30, 55]),
];

/** Screen loudspeakers of system G: the standard allows 5..25° or 35..60°, and gives no nominal azimuth. */
function screenSpeaker(label: 'M+SC' | 'M-SC'): LayoutChannel {
  const sign = label === 'M+SC' ? 1 : -1;
  const ranges: AngleRangeDeg[] =
    sign > 0
      ? [
          [5, 25],
          [35, 60],
        ]
      : [
          [-25, -5],
          [-60, -35],
        ];
  return {
    label,
    layer: 'middle',
    isLfe: false,
    azimuthDeg: 15 * sign,
    elevationDeg: 0,
    azimuthRangesDeg: ranges,
    elevationRangeDeg: [0, 0],
    note: 'The standard gives no nominal azimuth for the screen loudspeakers; ±15° is a reference value (the EBU ADM renderer uses the same), so the deviation reported for it is indicative only.',
  };
}

export const BS2051_LAYOUTS: readonly Layout[] = [
  {
    id: 'bs2051-a',
    system: 'A',
    name: '0+2+0',
    aliases: ['2.0', 'stereo'],
    title: 'Sound system A (0+2+0)',
    reference: `${BS2051}, Table 2 (table number from memory)`,
    channels: [ch('M+030', 30, 0), ch('M-030', -30, 0)],
    rules: COMMON_RULES,
    notes: [],
  },
  {
    id: 'bs2051-b',
    system: 'B',
    name: '0+5+0',
    aliases: ['5.1'],
    title: 'Sound system B (0+5+0)',
    reference: `${BS2051}, Table 3 (table number from memory)`,
    channels: [...FRONT_PAIR_FIXED, lfe('LFE1'), ...SURROUND_110_ELEVATED],
    rules: COMMON_RULES,
    notes: [LFE_NOTE],
  },
  {
    id: 'bs2051-c',
    system: 'C',
    name: '2+5+0',
    aliases: ['5.1.2'],
    title: 'Sound system C (2+5+0)',
    reference: `${BS2051}, Table 4 (table number from memory)`,
    channels: [...FRONT_PAIR_FIXED, lfe('LFE1'), ...SURROUND_110_ELEVATED, ...UPPER_030],
    rules: COMMON_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
  {
    id: 'bs2051-d',
    system: 'D',
    name: '4+5+0',
    aliases: ['5.1.4'],
    title: 'Sound system D (4+5+0)',
    reference: `${BS2051}, Table 5 (table number from memory)`,
    channels: [...FRONT_PAIR_FIXED, lfe('LFE1'), ...SURROUND_110, ...UPPER_030, ...UPPER_110],
    rules: COMMON_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
  {
    id: 'bs2051-e',
    system: 'E',
    name: '4+5+1',
    aliases: [],
    title: 'Sound system E (4+5+1)',
    reference: `${BS2051}, Table 6 (table number from memory)`,
    channels: [
      ...FRONT_PAIR_FIXED,
      lfe('LFE1'),
      ...SURROUND_110,
      ...UPPER_030,
      ...UPPER_110,
      ch('B+000', 0, -30, [0, 0], [-30, -15]),
    ],
    rules: COMMON_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
  {
    id: 'bs2051-f',
    system: 'F',
    name: '3+7+0',
    aliases: [],
    title: 'Sound system F (3+7+0)',
    reference: `${BS2051}, Table 7 (table number from memory)`,
    channels: [
      ch('M+000', 0, 0),
      ch('M+030', 30, 0),
      ch('M-030', -30, 0),
      ch('U+045', 45, 30, [30, 45], [30, 45]),
      ch('U-045', -45, 30, [-45, -30], [30, 45]),
      ch('M+090', 90, 0, [60, 150]),
      ch('M-090', -90, 0, [-150, -60]),
      ch('M+135', 135, 0, [60, 150]),
      ch('M-135', -135, 0, [-150, -60]),
      ch('UH+180', 180, 45, [180, 180], [45, 90]),
      lfeAt('LFE1', 45, [30, 90]),
      lfeAt('LFE2', -45, [-90, -30]),
    ],
    rules: COMMON_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
  {
    id: 'bs2051-g',
    system: 'G',
    name: '4+9+0',
    aliases: [],
    title: 'Sound system G (4+9+0)',
    reference: `${BS2051}, Table 8 (table number from memory)`,
    channels: [
      ...FRONT_PAIR_WIDE,
      lfe('LFE1'),
      ...SIDE_REAR_SURROUNDS,
      ...UPPER_045_135,
      screenSpeaker('M+SC'),
      screenSpeaker('M-SC'),
    ],
    rules: SURROUND_SPACING_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
  {
    id: 'bs2051-h',
    system: 'H',
    name: '9+10+3',
    aliases: ['22.2'],
    title: 'Sound system H (9+10+3)',
    reference: `${BS2051}, Table 9 (table number from memory)`,
    channels: [
      ch('M+060', 60, 0, [45, 60], [0, 5]),
      ch('M-060', -60, 0, [-60, -45], [0, 5]),
      ch('M+000', 0, 0, [0, 0], [0, 5]),
      lfeAt('LFE1', 45, [30, 90]),
      ch('M+135', 135, 0, [110, 135], [0, 15]),
      ch('M-135', -135, 0, [-135, -110], [0, 15]),
      ch('M+030', 30, 0, [22.5, 30], [0, 5]),
      ch('M-030', -30, 0, [-30, -22.5], [0, 5]),
      ch('M+180', 180, 0, [180, 180], [0, 15]),
      lfeAt('LFE2', -45, [-90, -30]),
      ch('M+090', 90, 0, [90, 90], [0, 15]),
      ch('M-090', -90, 0, [-90, -90], [0, 15]),
      ch('U+045', 45, 30, [45, 60], [30, 45]),
      ch('U-045', -45, 30, [-60, -45], [30, 45]),
      ch('U+000', 0, 30, [0, 0], [30, 45]),
      ch('T+000', 0, 90),
      ch('U+135', 135, 30, [110, 135], [30, 45]),
      ch('U-135', -135, 30, [-135, -110], [30, 45]),
      ch('U+090', 90, 30, [90, 90], [30, 45]),
      ch('U-090', -90, 30, [-90, -90], [30, 45]),
      ch('U+180', 180, 30, [180, 180], [30, 45]),
      ch('B+000', 0, -30, [0, 0], [-30, -15]),
      ch('B+045', 45, -30, [45, 60], [-30, -15]),
      ch('B-045', -45, -30, [-60, -45], [-30, -15]),
    ],
    rules: COMMON_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
  {
    id: 'bs2051-i',
    system: 'I',
    name: '0+7+0',
    aliases: ['7.1'],
    title: 'Sound system I (0+7+0)',
    reference: `${BS2051}, Table 10 (table number from memory)`,
    channels: [...FRONT_PAIR_WIDE, lfe('LFE1'), ...SIDE_REAR_SURROUNDS],
    rules: SURROUND_SPACING_RULES,
    notes: [LFE_NOTE],
  },
  {
    id: 'bs2051-j',
    system: 'J',
    name: '4+7+0',
    aliases: ['7.1.4'],
    title: 'Sound system J (4+7+0)',
    reference: `${BS2051}, Table 11 (table number from memory)`,
    channels: [...FRONT_PAIR_WIDE, lfe('LFE1'), ...SIDE_REAR_SURROUNDS, ...UPPER_045_135],
    rules: SURROUND_SPACING_RULES,
    notes: [LFE_NOTE, TIME_ALIGN_NOTE],
  },
];
