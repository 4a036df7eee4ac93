import type { ChartSeries, ChartSpec } from '../ui/chart/chart-spec';
import type { Room, RoomLoudspeaker } from './room.model';

/** Where a loudspeaker sits in height, read from its ITU-R BS.2051 label (M, U, T, B, LFE). */
export type SpeakerLayer = 'middle' | 'upper' | 'bottom' | 'lfe' | 'other';

export function speakerLayer(id: string): SpeakerLayer {
  if (/^LFE/i.test(id)) return 'lfe';
  if (/^M[+-]/.test(id)) return 'middle';
  if (/^[UT][+-]/.test(id)) return 'upper';
  if (/^B[+-]/.test(id)) return 'bottom';
  return 'other';
}

const LAYERS: Array<{
  layer: SpeakerLayer;
  label: string;
  colour: number;
  style: ChartSeries['pointStyle'];
}> = [
  { layer: 'middle', label: 'Ear level', colour: 1, style: 'circle' },
  { layer: 'upper', label: 'Overhead', colour: 3, style: 'triangle' },
  { layer: 'bottom', label: 'Below ear level', colour: 4, style: 'rectRot' },
  { layer: 'lfe', label: 'Subwoofer', colour: 2, style: 'rect' },
  { layer: 'other', label: 'Other', colour: 6, style: 'circle' },
];

const MARGIN_M = 0.4;

function metres(value: number): string {
  return `${value.toFixed(2)} m`;
}

/**
 * The room seen from above in the API's coordinates: x to the right, y from the front wall toward the
 * back (drawn downward, so the front wall is at the top, as a person faces it), the walls as an
 * outline, every loudspeaker labelled with its channel, marked by layer, and the listening position.
 */
export function topViewChart(
  room: Pick<Room, 'dimensions' | 'listener' | 'loudspeakers' | 'name'>,
): ChartSpec {
  const { widthM, lengthM } = room.dimensions;
  const outline: ChartSeries = {
    label: 'Walls',
    colour: 0,
    showLine: true,
    pointRadius: 0,
    points: [
      { x: 0, y: 0 },
      { x: widthM, y: 0 },
      { x: widthM, y: lengthM },
      { x: 0, y: lengthM },
      { x: 0, y: 0 },
    ],
  };
  const byLayer = (layer: SpeakerLayer): RoomLoudspeaker[] =>
    room.loudspeakers.filter((speaker) => speakerLayer(speaker.id) === layer);
  const speakers = LAYERS.flatMap(({ layer, label, colour, style }) => {
    const members = byLayer(layer);
    if (!members.length) return [];
    return [
      {
        label,
        colour,
        pointStyle: style,
        points: members.map((speaker) => ({ x: speaker.x, y: speaker.y })),
        pointLabels: members.map((speaker) => speaker.id),
      } satisfies ChartSeries,
    ];
  });
  const listener: ChartSeries = {
    label: 'Listening position',
    colour: 5,
    pointStyle: 'crossRot',
    pointRadius: 8,
    points: [{ x: room.listener.x, y: room.listener.y }],
    pointLabels: ['Listener'],
  };
  const spanX = widthM + 2 * MARGIN_M;
  const spanY = lengthM + 2 * MARGIN_M;
  return {
    kind: 'scatter',
    xScale: 'linear',
    xMin: -MARGIN_M,
    xMax: widthM + MARGIN_M,
    yMin: -MARGIN_M,
    yMax: lengthM + MARGIN_M,
    yReverse: true,
    // The legend and axes take some height; a little extra width keeps metres close to square.
    aspectRatio: Math.min(1.8, Math.max(0.6, (spanX / spanY) * 1.1)),
    xTitle: 'x (m), left wall to right wall',
    yTitle: 'y (m), front wall to back wall',
    series: [outline, ...speakers, listener],
    summary:
      `Floor plan of ${room.name} seen from above, front wall at the top: ${metres(widthM)} wide and ` +
      `${metres(lengthM)} long, ${room.loudspeakers.length} loudspeakers, listening position at x ` +
      `${metres(room.listener.x)}, y ${metres(room.listener.y)}.`,
  };
}
