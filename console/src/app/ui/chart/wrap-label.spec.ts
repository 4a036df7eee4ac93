import { wrapLabel } from './wrap-label';

describe('wrapLabel', () => {
  it('keeps a short label on one line', () => {
    expect(wrapLabel('GET /v1/rooms', 24)).toEqual(['GET /v1/rooms']);
  });

  it('breaks a route after slashes, every line within the width, nothing lost', () => {
    const route = 'GET /v1/rooms/{roomId}/measurements/average';
    const lines = wrapLabel(route, 20);
    expect(lines.length).toBeGreaterThan(1);
    for (const line of lines) expect(line.length).toBeLessThanOrEqual(20);
    expect(lines.join('').replace(/\s/g, '')).toBe(route.replace(/\s/g, ''));
    expect(lines[0]).toBe('GET /v1/rooms/');
  });

  it('cuts a part longer than a line inside the word', () => {
    expect(wrapLabel('abcdefghij', 4)).toEqual(['abcd', 'efgh', 'ij']);
  });
});
