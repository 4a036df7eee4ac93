/**
 * The one colour-and-shape code for loudspeakers on a plan, used by the console's top view and the
 * printed report alike: shape by layer (so it survives black-and-white printing and colour blindness),
 * colour by layer as a second cue, and a ring for a loudspeaker outside its layout's permitted range.
 * `seriesColour` is the console's theme colour slot (1–6, light and dark variants in its theme);
 * `printColour` is that slot's light-theme value, used on paper.
 */
export type SpeakerMarkKind = 'middle' | 'upper' | 'bottom' | 'lfe' | 'other';
export type SpeakerShape = 'circle' | 'triangle' | 'rectRot' | 'rect';

export interface SpeakerMark {
  kind: SpeakerMarkKind;
  label: string;
  shape: SpeakerShape;
  seriesColour: number;
  printColour: string;
}

export const SPEAKER_MARKS: readonly SpeakerMark[] = [
  { kind: 'middle', label: 'Ear level', shape: 'circle', seriesColour: 1, printColour: '#15696d' },
  { kind: 'upper', label: 'Overhead', shape: 'triangle', seriesColour: 3, printColour: '#7a3fa0' },
  { kind: 'bottom', label: 'Below ear level', shape: 'rectRot', seriesColour: 4, printColour: '#3a6a12' },
  { kind: 'lfe', label: 'Subwoofer', shape: 'rect', seriesColour: 6, printColour: '#2f4f9a' },
  { kind: 'other', label: 'Other', shape: 'circle', seriesColour: 2, printColour: '#b0620a' },
];

/** A ring around the mark: the loudspeaker lies outside the layout's permitted azimuth or elevation. */
export const OUT_OF_RANGE_MARK = {
  label: 'Outside the permitted range',
  seriesColour: 5,
  printColour: '#b3261e',
} as const;

/** The mark kind of a channel, from its ITU-R BS.2051 label prefix (M, U/UH/T, B, LFE). */
export function speakerMarkKind(id: string): SpeakerMarkKind {
  if (/^LFE/i.test(id)) return 'lfe';
  if (/^M[+-]/.test(id)) return 'middle';
  if (/^(UH|U|T)[+-]/.test(id) || /^T\+000$/.test(id)) return 'upper';
  if (/^B[+-]/.test(id)) return 'bottom';
  return 'other';
}

export function speakerMark(id: string): SpeakerMark {
  const kind = speakerMarkKind(id);
  return SPEAKER_MARKS.find((mark) => mark.kind === kind) ?? SPEAKER_MARKS[SPEAKER_MARKS.length - 1];
}
