import { findLayout } from '../../shared/layouts';
import { roomGeometry } from '../../shared/geometry';
import type { Room } from '../db/models/room';

export type RoomView = ReturnType<typeof roomDto>;

/** The API shape of a stored room, with its geometry computed on the way out. */
export function roomDto(room: Room) {
  const layout = findLayout(room.layoutId);
  const definition = {
    layout: room.layoutId,
    dimensions: room.dimensions,
    listener: room.listener,
    loudspeakers: room.loudspeakers,
  };
  const geometry = roomGeometry(definition);
  return {
    id: room.id,
    ownerId: room.ownerId,
    name: room.name,
    layout: room.layoutId,
    layoutName: layout?.name ?? room.layoutId,
    dimensions: room.dimensions,
    listener: room.listener,
    loudspeakers: room.loudspeakers,
    limits: room.limits,
    sampleRateHz: room.sampleRateHz,
    profileId: room.profileId ?? null,
    notes: room.notes,
    createdAt: room.createdAt.toISOString(),
    updatedAt: room.updatedAt.toISOString(),
    geometry: {
      angleToleranceDeg: geometry.angleToleranceDeg,
      speakers: geometry.speakers,
      warnings: geometry.warnings,
    },
  };
}
