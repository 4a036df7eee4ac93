import type { Room } from './room.model';

function metres(value: number): string {
  return `${value.toFixed(2)} m`;
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
