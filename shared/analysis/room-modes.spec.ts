import { expectWithin } from '../filters/test-helpers';
import { roomModes, roomVolumeM3, schroederFrequencyHz } from './room-modes';

// Demo room Stage 3 (invented): 6.10 m wide, 7.40 m long, 3.05 m high; c = 343.2 m/s (20 °C).
const stage3 = { widthM: 6.1, lengthM: 7.4, heightM: 3.05 };
const c = 343.2;

describe('rectangular-room modes f = (c/2)·sqrt((nx/Lx)² + (ny/Ly)² + (nz/Lz)²) (Kuttruff; pyrato [lib])', () => {
  const { modes } = roomModes(stage3, c, 120);
  const find = (nx: number, ny: number, nz: number) =>
    modes.find((m) => m.nx === nx && m.ny === ny && m.nz === nz);

  it.each([
    ['first length mode', 0, 1, 0, c / (2 * 7.4)],
    ['first width mode', 1, 0, 0, c / (2 * 6.1)],
    ['first height mode', 0, 0, 1, c / (2 * 3.05)],
    ['second length mode', 0, 2, 0, (2 * c) / (2 * 7.4)],
    ['third width mode', 3, 0, 0, (3 * c) / (2 * 6.1)],
  ])('axial %s is n·c/2L', (_name, nx, ny, nz, expected) => {
    const mode = find(nx, ny, nz)!;
    expect(mode.kind).toBe('axial');
    expectWithin(mode.frequencyHz, expected, 1e-9, `(${nx},${ny},${nz})`);
  });

  it('computes hand-worked axial values: 23.189 Hz (length), 28.131 Hz (width), 56.262 Hz (height)', () => {
    expectWithin(find(0, 1, 0)!.frequencyHz, 23.189189, 1e-5, 'length');
    expectWithin(find(1, 0, 0)!.frequencyHz, 28.131148, 1e-5, 'width');
    expectWithin(find(0, 0, 1)!.frequencyHz, 56.262295, 1e-5, 'height');
  });

  it('combines axial terms for tangential and oblique modes', () => {
    const tangential = find(1, 1, 0)!;
    expect(tangential.kind).toBe('tangential');
    expectWithin(tangential.frequencyHz, Math.hypot(c / 12.2, c / 14.8), 1e-9, '(1,1,0)');
    const oblique = find(1, 1, 1)!;
    expect(oblique.kind).toBe('oblique');
    expectWithin(oblique.frequencyHz, Math.hypot(c / 12.2, c / 14.8, c / 6.1), 1e-9, '(1,1,1)');
  });

  it('lists modes in ascending order, all at or below the limit, lowest first', () => {
    expect(modes[0]).toMatchObject({ nx: 0, ny: 1, nz: 0 });
    for (let i = 1; i < modes.length; i++)
      expect(modes[i].frequencyHz).toBeGreaterThanOrEqual(modes[i - 1].frequencyHz);
    expect(modes[modes.length - 1].frequencyHz).toBeLessThanOrEqual(120);
  });

  it('counts modes close to the asymptotic estimate N ≈ 4πVf³/(3c³) + πSf²/(4c²) + Lf/(8c) (Kuttruff, Room Acoustics; from memory)', () => {
    const f = 300;
    const { modes: all } = roomModes(stage3, c, f, 5000);
    const V = 6.1 * 7.4 * 3.05;
    const S = 2 * (6.1 * 7.4 + 6.1 * 3.05 + 7.4 * 3.05);
    const L = 4 * (6.1 + 7.4 + 3.05);
    const estimate =
      (4 * Math.PI * V * f ** 3) / (3 * c ** 3) + (Math.PI * S * f ** 2) / (4 * c ** 2) + (L * f) / (8 * c);
    expect(Math.abs(all.length / estimate - 1)).toBeLessThan(0.05);
  });

  it('stops at maxModes and says so', () => {
    const result = roomModes(stage3, c, 300, 10);
    expect(result.modes).toHaveLength(10);
    expect(result.truncated).toBe(true);
  });

  it('refuses a zero dimension, naming the field', () => {
    expect(() => roomModes({ ...stage3, heightM: 0 }, c, 100)).toThrow(
      expect.objectContaining({ field: '/heightM' }),
    );
  });
});

describe('Schroeder frequency 2000·sqrt(T60/V) (Kuttruff [lib])', () => {
  it('is 93.36 Hz for Stage 3 (V = 137.677 m³) at T60 = 0.3 s', () => {
    const V = roomVolumeM3(stage3);
    expectWithin(V, 137.677, 1e-9, 'volume');
    expectWithin(schroederFrequencyHz(0.3, V), 2000 * Math.sqrt(0.3 / 137.677), 1e-12, 'fS');
    expectWithin(schroederFrequencyHz(0.3, V), 93.36, 0.01, 'fS rounded');
  });

  it('refuses a zero reverberation time', () => {
    expect(() => schroederFrequencyHz(0, 100)).toThrow(/reverberationTimeS/);
  });
});
