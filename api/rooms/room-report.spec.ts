import { roomGeometry } from '../../shared/geometry';
import { findLayout } from '../../shared/layouts';
import { esc, num, signed } from './report-html';
import { renderRoomReport } from './room-report';
import { responseSvg } from './response-svg';
import { topViewSvg } from './top-view-svg';

const room = {
  name: 'Small <room>',
  notes: null,
  dimensions: { widthM: 4, lengthM: 5, heightM: 2.8 },
  listener: { x: 2, y: 2.5, z: 1.2 },
  loudspeakers: [
    { id: 'M+030', x: 1, y: 0.768, z: 1.2 },
    { id: 'M-030', x: 3, y: 0.768, z: 1.2 },
  ],
};

describe('report helpers', () => {
  it('escape markup and format numbers with a real minus sign', () => {
    expect(esc('<a href="x">&\'</a>')).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&#39;&lt;/a&gt;');
    expect(num(-1.234, 2)).toBe('−1.23');
    expect(num(-0.001, 1)).toBe('0.0');
    expect(signed(2, 1)).toBe('+2.0');
    expect(num(null, 1)).toBe('—');
  });
});

describe('topViewSvg', () => {
  it('draws the front wall at the top and each loudspeaker at its x/y', () => {
    const geometry = roomGeometry({ ...room, layout: 'A' });
    const svg = topViewSvg({ ...room, geometry: geometry.speakers, layout: findLayout('A') });
    // Scale: (520 − 2·44) px over max(4 m, 0.8·5 m) = 108 px/m; M+030 at x 1 m → 44 + 108 = 152 px.
    expect(svg).toContain('<circle cx="152.0" cy="126.9" r="7"');
    expect(svg.indexOf('>front<')).toBeGreaterThan(0);
    expect(svg).not.toMatch(/href=|<script/);
  });
});

/** The number grammar of SVG 1.1 (§4.2): an ASCII sign, digits, an optional fraction and exponent. */
const SVG_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NUMERIC_ATTRIBUTES = ['x', 'y', 'x1', 'y1', 'x2', 'y2', 'cx', 'cy', 'r', 'width', 'height'];

/**
 * Parses an SVG fragment as XML far enough to find what a viewer would refuse: tags that do not nest,
 * numeric attributes outside the SVG number grammar, and path data with anything but commands and
 * numbers. Returns the problems found.
 */
function svgProblems(svg: string): string[] {
  const problems: string[] = [];
  const open: string[] = [];
  for (const [, closing, name, attributes, selfClosing] of svg.matchAll(/<(\/?)([a-z]+)([^>]*?)(\/?)>/g)) {
    if (closing) {
      if (open.pop() !== name) problems.push(`</${name}> closes nothing`);
      continue;
    }
    if (!selfClosing) open.push(name);
    for (const [, attribute, value] of attributes.matchAll(/([a-z0-9-]+)="([^"]*)"/g)) {
      if (NUMERIC_ATTRIBUTES.includes(attribute) && !SVG_NUMBER.test(value))
        problems.push(`${attribute}="${value}"`);
      if (attribute === 'd') {
        for (const token of value.split(/[\s,]+|(?=[MLHVCSQTAZmlhvcsqtaz])|(?<=[MLHVCSQTAZmlhvcsqtaz])/)) {
          if (token && !/^[MLHVCSQTAZmlhvcsqtaz]$/.test(token) && !SVG_NUMBER.test(token))
            problems.push(`d: ${token}`);
        }
      }
      if (attribute === 'viewBox' && !value.split(' ').every((n) => SVG_NUMBER.test(n)))
        problems.push(`viewBox="${value}"`);
    }
  }
  if (open.length > 0) problems.push(`unclosed ${open.join(', ')}`);
  return problems;
}

describe('the report SVGs parse', () => {
  it('a response that dips below the plot writes coordinates with an ASCII minus', () => {
    const svg = responseSvg([10, 20, 100, 1000, 20000], [-40, -6, 0, 14, -100], 'M+030');
    expect(svg).not.toContain('−');
    expect(svgProblems(svg)).toEqual([]);
  });

  it('a listener near a wall, with nominal directions reaching past the plot, parses too', () => {
    const nearWall = { ...room, listener: { x: 0.2, y: 0.3, z: 1.2 } };
    const geometry = roomGeometry({ ...nearWall, layout: 'A' });
    const svg = topViewSvg({ ...nearWall, geometry: geometry.speakers, layout: findLayout('A') });
    expect(svg).toMatch(/="-\d/);
    expect(svgProblems(svg)).toEqual([]);
  });

  it('finds the Unicode minus the report once wrote', () => {
    expect(svgProblems('<svg><line x2="−100.5"/></svg>')).toEqual(['x2="−100.5"']);
  });
});

describe('renderRoomReport', () => {
  it('is one escaped, self-contained HTML page', () => {
    const html = renderRoomReport({
      room,
      layout: findLayout('A'),
      geometry: roomGeometry({ ...room, layout: 'A' }),
      tuning: null,
      generatedAt: new Date('2026-03-02T10:00:00Z'),
    });
    expect(html.startsWith('<!doctype html>')).toBe(true);
    expect(html).toContain('<h1>Small &lt;room&gt;</h1>');
    expect(html).toContain('generated 2026-03-02 10:00 UTC');
    expect(html).not.toMatch(/<script|<link|src=|url\(/i);
  });
});
