import { roomGeometry } from '../../shared/geometry';
import { findLayout } from '../../shared/layouts';
import { esc, num, signed } from './report-html';
import { renderRoomReport } from './room-report';
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
