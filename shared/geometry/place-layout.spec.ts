import { findLayout } from '../layouts';
import { toListenerPolar } from './coordinates';
import { placeLayoutLoudspeakers, WALL_CLEARANCE_M } from './place-layout';

const room = { widthM: 6.1, lengthM: 7.4, heightM: 3.05 };
const listener = { x: 3.05, y: 3.3, z: 1.2 };

describe('placeLayoutLoudspeakers', () => {
  it('puts every positioned channel of 7.1.4 at its nominal angles and the chosen distance', () => {
    const layout = findLayout('7.1.4')!;
    const placed = placeLayoutLoudspeakers(layout.channels, listener, 2.5, room);
    expect(placed.map((p) => p.id)).toEqual(layout.channels.map((c) => c.label));
    for (const channel of layout.channels) {
      const speaker = placed.find((p) => p.id === channel.label)!;
      if (channel.azimuthDeg === null || channel.elevationDeg === null) continue;
      const polar = toListenerPolar(listener, speaker);
      // Independent check: the inverse conversion gives back the nominal direction.
      expect(polar.azimuthDeg).toBeCloseTo(channel.azimuthDeg, 9);
      expect(polar.elevationDeg).toBeCloseTo(channel.elevationDeg, 9);
      if (!speaker.pulledIn) expect(polar.distanceM).toBeCloseTo(2.5, 9);
    }
    // M+030 at 2.5 m: x = 3.05 − 2.5·sin 30° = 1.80, y = 3.3 − 2.5·cos 30° = 1.135 (hand-computed).
    const left = placed.find((p) => p.id === 'M+030')!;
    expect(left.x).toBeCloseTo(1.8, 9);
    expect(left.y).toBeCloseTo(1.1349365, 6);
    expect(left.z).toBeCloseTo(1.2, 9);
  });

  it('pulls a point that would leave the room back along its own direction', () => {
    const layout = findLayout('7.1.4')!;
    const placed = placeLayoutLoudspeakers(layout.channels, listener, 4, room);
    const top = placed.find((p) => p.id === 'U+045')!;
    // U+045 at 4 m would be 1.2 + 4·sin 30° = 3.2 m high, above the 3.05 m ceiling.
    expect(top.pulledIn).toBe(true);
    expect(top.z).toBeCloseTo(room.heightM - WALL_CLEARANCE_M, 9);
    const polar = toListenerPolar(listener, top);
    expect(polar.azimuthDeg).toBeCloseTo(45, 9);
    expect(polar.elevationDeg).toBeCloseTo(30, 9);
    expect(polar.distanceM).toBeLessThan(4);
    for (const p of placed) {
      expect(p.x).toBeGreaterThanOrEqual(WALL_CLEARANCE_M - 1e-12);
      expect(p.x).toBeLessThanOrEqual(room.widthM - WALL_CLEARANCE_M + 1e-12);
      expect(p.y).toBeGreaterThanOrEqual(WALL_CLEARANCE_M - 1e-12);
      expect(p.y).toBeLessThanOrEqual(room.lengthM - WALL_CLEARANCE_M + 1e-12);
    }
  });

  it('puts an LFE channel without a direction on the floor by the front wall', () => {
    const placed = placeLayoutLoudspeakers(
      [{ label: 'LFE1', azimuthDeg: null, elevationDeg: null }],
      listener,
      2,
      room,
    );
    expect(placed[0]).toMatchObject({ id: 'LFE1', x: 6.1 / 4, z: 0.25, pulledIn: false });
    expect(placed[0].y).toBeCloseTo(0.3, 12);
  });
});
