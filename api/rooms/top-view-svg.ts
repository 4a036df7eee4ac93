import type { Layout } from '../../shared/layouts';
import type { SpeakerGeometry } from '../../shared/geometry';
import {
  OUT_OF_RANGE_MARK,
  SPEAKER_MARKS,
  speakerMark,
  type SpeakerShape,
} from '../../shared/geometry/speaker-marks';
import { coord, esc, num } from './report-html';

export interface TopViewInput {
  dimensions: { widthM: number; lengthM: number; heightM: number };
  listener: { x: number; y: number; z: number };
  loudspeakers: ReadonlyArray<{ id: string; x: number; y: number; z: number }>;
  geometry: readonly SpeakerGeometry[];
  layout: Layout | undefined;
}

const WIDTH_PX = 520;
const PAD_PX = 44;
/** One mark of the shared code (shared/geometry/speaker-marks.ts) as SVG, centred on (x, y). */
export function markSvg(shape: SpeakerShape, x: number, y: number, fill: string): string {
  switch (shape) {
    case 'rect':
      return `<rect x="${coord(x - 7)}" y="${coord(y - 7)}" width="14" height="14" fill="${fill}"/>`;
    case 'triangle':
      return `<path d="M${coord(x)} ${coord(y - 8)} L${coord(x + 8)} ${coord(y + 6)} L${coord(x - 8)} ${coord(y + 6)} Z" fill="${fill}"/>`;
    case 'rectRot':
      return `<path d="M${coord(x)} ${coord(y - 8)} L${coord(x + 8)} ${coord(y)} L${coord(x)} ${coord(y + 8)} L${coord(x - 8)} ${coord(y)} Z" fill="${fill}"/>`;
    default:
      return `<circle cx="${coord(x)}" cy="${coord(y)}" r="7" fill="${fill}"/>`;
  }
}

/**
 * The room seen from above as inline SVG: front wall at the top, the listening position, every
 * loudspeaker at its measured x/y in the shared mark code (shape and colour by layer, a ring when outside
 * the layout's permitted range), a thin
 * line from the listener to each, and a dashed ray along each loudspeaker's nominal azimuth so the
 * deviation shows. Scale 1 m = `scale` px; no external assets.
 */
export function topViewSvg(input: TopViewInput): string {
  const { widthM, lengthM } = input.dimensions;
  const scale = (WIDTH_PX - 2 * PAD_PX) / Math.max(widthM, lengthM * 0.8);
  const w = widthM * scale + 2 * PAD_PX;
  const h = lengthM * scale + 2 * PAD_PX;
  const px = (x: number) => PAD_PX + x * scale;
  const py = (y: number) => PAD_PX + y * scale;
  const lx = px(input.listener.x);
  const ly = py(input.listener.y);
  const parts: string[] = [];
  parts.push(
    `<rect x="${PAD_PX}" y="${PAD_PX}" width="${coord(widthM * scale)}" height="${coord(lengthM * scale)}" class="room"/>`,
  );
  parts.push(`<text x="${coord(w / 2)}" y="${PAD_PX - 10}" class="wall">front</text>`);
  parts.push(`<text x="${coord(w / 2)}" y="${coord(h - PAD_PX + 22)}" class="wall">back</text>`);
  parts.push(
    `<text x="${PAD_PX}" y="${coord(h - 8)}" class="scale">${num(widthM, 2)} m × ${num(lengthM, 2)} m</text>`,
  );
  for (const g of input.geometry) {
    const speaker = input.loudspeakers.find((s) => s.id === g.id);
    if (!speaker) continue;
    const sx = px(speaker.x);
    const sy = py(speaker.y);
    parts.push(`<line x1="${coord(lx)}" y1="${coord(ly)}" x2="${coord(sx)}" y2="${coord(sy)}" class="ray"/>`);
    if (g.nominal && !g.id.startsWith('LFE')) {
      const reach = Math.hypot(sx - lx, sy - ly);
      const az = (g.nominal.azimuthDeg * Math.PI) / 180;
      parts.push(
        `<line x1="${coord(lx)}" y1="${coord(ly)}" x2="${coord(lx - reach * Math.sin(az))}" y2="${coord(ly - reach * Math.cos(az))}" class="nominal"/>`,
      );
    }
  }
  for (const speaker of input.loudspeakers) {
    const sx = px(speaker.x);
    const sy = py(speaker.y);
    const mark = speakerMark(speaker.id);
    const outside = input.geometry.find((g) => g.id === speaker.id)?.withinTolerance === false;
    const ring = outside
      ? `<circle cx="${coord(sx)}" cy="${coord(sy)}" r="12" fill="none" stroke="${OUT_OF_RANGE_MARK.printColour}" stroke-width="2.5"/>`
      : '';
    const shape = markSvg(mark.shape, sx, sy, mark.printColour) + ring;
    const labelY = sy < ly ? sy - 11 : sy + 20;
    parts.push(
      `<g>${shape}<text x="${coord(sx)}" y="${coord(labelY)}" class="label">${esc(speaker.id)}</text></g>`,
    );
  }
  parts.push(
    `<g class="listener"><circle cx="${coord(lx)}" cy="${coord(ly)}" r="9"/><path d="M${coord(lx - 5)} ${coord(ly - 7)} L${coord(lx)} ${coord(ly - 15)} L${coord(lx + 5)} ${coord(ly - 7)} z"/></g>`,
  );
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${coord(w)} ${coord(h)}" width="${Math.round(w)}" height="${Math.round(h)}" role="img" aria-label="Top view of the room with the listening position and every loudspeaker">`,
    '<style>.room{fill:#fafaf7;stroke:#222;stroke-width:2}.wall{font:600 11px sans-serif;text-anchor:middle;fill:#444;text-transform:uppercase;letter-spacing:.1em}.scale{font:10px sans-serif;fill:#555}.ray{stroke:#9aa;stroke-width:1}.nominal{stroke:#c33;stroke-width:1;stroke-dasharray:4 3}.label{font:600 10px sans-serif;text-anchor:middle;fill:#111}.listener circle,.listener path{fill:#111}</style>',
    ...parts,
    '</svg>',
  ].join('');
}

/** The legend of the marks the plan uses, in the shared code's order, with the nominal-direction ray.
 * Drawn with CSS (classes `mk-<shape>` in the report's style sheet) so the page has one SVG per figure. */
export function topViewLegend(ids: readonly string[]): string {
  const used = new Set(ids.map((id) => speakerMark(id).kind));
  const items = SPEAKER_MARKS.filter((mark) => used.has(mark.kind)).map(
    (mark) =>
      `<span><i class="mk mk-${mark.shape}" style="background:${mark.printColour}"></i>${esc(mark.label)}</span>`,
  );
  items.push(
    `<span><i class="mk mk-ring" style="border-color:${OUT_OF_RANGE_MARK.printColour}"></i>${esc(OUT_OF_RANGE_MARK.label)}</span>`,
    '<span>dashed red: nominal direction</span>',
  );
  return `<p class="legend">${items.join('')}</p>`;
}
