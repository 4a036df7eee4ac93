import { coord, esc } from './report-html';

const W = 260;
const H = 120;
const LEFT = 30;
const BOTTOM = 18;
const F_MIN = 20;
const F_MAX = 20000;
const DB_MIN = -30;
const DB_MAX = 12;

/**
 * A small magnitude plot as inline SVG: log frequency 20 Hz–20 kHz, −30..+12 dB, grid at decades and
 * every 6 dB; values outside the range are drawn at the edge. `before`, when given, is drawn dashed
 * underneath (the verification's before/after plots).
 */
export function responseSvg(
  frequenciesHz: readonly number[],
  magnitudeDb: readonly number[],
  title: string,
  before?: { frequenciesHz: readonly number[]; magnitudeDb: readonly number[] },
): string {
  const x = (f: number) =>
    LEFT + ((Math.log10(f) - Math.log10(F_MIN)) / (Math.log10(F_MAX) - Math.log10(F_MIN))) * (W - LEFT - 4);
  const y = (db: number) =>
    4 + ((DB_MAX - Math.min(DB_MAX, Math.max(DB_MIN, db))) / (DB_MAX - DB_MIN)) * (H - BOTTOM - 4);
  const grid: string[] = [];
  for (const f of [100, 1000, 10000])
    grid.push(`<line x1="${coord(x(f))}" y1="4" x2="${coord(x(f))}" y2="${H - BOTTOM}" class="g"/>`);
  for (const [f, label] of [
    [20, '20'],
    [100, '100'],
    [1000, '1k'],
    [10000, '10k'],
  ] as const) {
    grid.push(`<text x="${coord(x(f))}" y="${H - 5}" class="t">${label}</text>`);
  }
  for (let db = DB_MIN; db <= DB_MAX; db += 6) {
    grid.push(
      `<line x1="${LEFT}" y1="${coord(y(db))}" x2="${W - 4}" y2="${coord(y(db))}" class="${db === 0 ? 'z' : 'g'}"/>`,
    );
    grid.push(`<text x="${LEFT - 3}" y="${coord(y(db) + 3)}" class="d">${db}</text>`);
  }
  const path = (fs: readonly number[], dbs: readonly number[]) =>
    fs
      .map((f, i) => ({ f, db: dbs[i] }))
      .filter((p) => p.f >= F_MIN && p.f <= F_MAX)
      .map((p, i) => `${i === 0 ? 'M' : 'L'}${coord(x(p.f))} ${coord(y(p.db))}`)
      .join(' ');
  const points = path(frequenciesHz, magnitudeDb);
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${esc(title)}">`,
    '<style>.g{stroke:#ddd;stroke-width:.6}.z{stroke:#888;stroke-width:.8}.t{font:8px sans-serif;text-anchor:middle;fill:#555}.d{font:8px sans-serif;text-anchor:end;fill:#555}.c{fill:none;stroke:#1d5a85;stroke-width:1.6}.b{fill:none;stroke:#a4551b;stroke-width:1.1;stroke-dasharray:3 2}</style>',
    ...grid,
    ...(before ? [`<path d="${path(before.frequenciesHz, before.magnitudeDb)}" class="b"/>`] : []),
    `<path d="${points}" class="c"/>`,
    '</svg>',
  ].join('');
}
