export { angleBetweenDeg, insideAzimuthRange, insideElevationRange, wrapDeg } from './angles';
export { fromListenerPolar, toListenerPolar, type ListenerPolar, type RoomPoint } from './coordinates';
export {
  analyseGeometry,
  GEOMETRY_LIMITS,
  requireInsideRoom,
  requireUniqueIds,
  type GeometryInput,
  type GeometryResult,
  type GeometrySpeakerInput,
  type GeometryWarning,
  type RoomDimensions,
  type SpeakerGeometry,
} from './analyse-geometry';
export { checkRoomDefinition, roomGeometry, type RoomDefinition, type RoomLoudspeaker } from './room';
