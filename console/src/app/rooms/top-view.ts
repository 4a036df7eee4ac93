import type { ChartSeries, ChartSpec } from '../ui/chart/chart-spec';
import { OUT_OF_RANGE_MARK, SPEAKER_MARKS, speakerMarkKind } from '../../../../shared/geometry/speaker-marks';
import type { Room, RoomLoudspeaker, SpeakerGeometry } from './room.model';

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
  geometry: ReadonlyArray<Pick<SpeakerGeometry, 'id' | 'withinTolerance'>> = [],
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
  const speakers = SPEAKER_MARKS.flatMap(({ kind, label, seriesColour, shape }) => {
    const members: RoomLoudspeaker[] = room.loudspeakers.filter(
      (speaker) => speakerMarkKind(speaker.id) === kind,
    );
    if (!members.length) return [];
    return [
      {
        label,
        colour: seriesColour,
        pointStyle: shape,
        points: members.map((speaker) => ({ x: speaker.x, y: speaker.y })),
        pointLabels: members.map((speaker) => speaker.id),
      } satisfies ChartSeries,
    ];
  });
  const outside = new Set(geometry.filter((g) => g.withinTolerance === false).map((g) => g.id));
  const outOfRange: ChartSeries[] = outside.size
    ? [
        {
          label: OUT_OF_RANGE_MARK.label,
          colour: OUT_OF_RANGE_MARK.seriesColour,
          pointStyle: 'circle',
          pointRadius: 12,
          hollow: true,
          points: room.loudspeakers
            .filter((speaker) => outside.has(speaker.id))
            .map((speaker) => ({ x: speaker.x, y: speaker.y })),
        },
      ]
    : [];
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
    series: [outline, ...speakers, ...outOfRange, listener],
    summary: topViewSummary(room, outside),
  };
}

/** What a screen reader hears in place of the plan: size, loudspeaker count, listener, those out of range. */
export function topViewSummary(
  room: Pick<Room, 'dimensions' | 'listener' | 'loudspeakers' | 'name'>,
  outside: ReadonlySet<string>,
): string {
  const { widthM, lengthM } = room.dimensions;
  return (
    `Floor plan of ${room.name} seen from above, front wall at the top: ${metres(widthM)} wide and ` +
    `${metres(lengthM)} long, ${room.loudspeakers.length} loudspeakers, listening position at x ` +
    `${metres(room.listener.x)}, y ${metres(room.listener.y)}.` +
    (outside.size ? ` Outside the layout's permitted range: ${[...outside].join(', ')}.` : '')
  );
}
