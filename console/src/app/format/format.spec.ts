import {
  formatCount,
  formatDate,
  formatDateTime,
  formatPercent,
  formatQuantity,
  formatRelative,
  formatSigned,
} from './format';

describe('formatDateTime', () => {
  it('writes ISO-like local times in the requested zone', () => {
    expect(formatDateTime('2026-03-14T09:30:00Z', 'UTC')).toBe('2026-03-14 09:30');
    // Europe/Berlin is UTC+1 in March before the switch to summer time (last Sunday of March).
    expect(formatDateTime('2026-03-14T23:30:00Z', 'Europe/Berlin')).toBe('2026-03-15 00:30');
    expect(formatDate('2026-03-14T23:30:00Z', 'UTC')).toBe('2026-03-14');
  });

  it('shows a dash for missing or unreadable dates', () => {
    expect(formatDateTime(null)).toBe('—');
    expect(formatDateTime('not a date')).toBe('—');
    expect(formatDate(undefined)).toBe('—');
  });
});

describe('formatRelative', () => {
  const now = new Date('2026-03-14T12:00:00Z');
  it('describes past and future distances in words', () => {
    expect(formatRelative('2026-03-14T11:59:30Z', now)).toBe('just now');
    expect(formatRelative('2026-03-14T11:55:00Z', now)).toBe('5 min ago');
    expect(formatRelative('2026-03-14T09:00:00Z', now)).toBe('3 h ago');
    expect(formatRelative('2026-03-13T11:00:00Z', now)).toBe('1 day ago');
    expect(formatRelative('2026-03-18T12:00:00Z', now)).toBe('in 4 days');
    expect(formatRelative(null, now)).toBe('never');
    expect(formatRelative(null, now, 'no expiry')).toBe('no expiry');
  });
});

describe('formatCount and formatPercent', () => {
  it('groups thousands and rounds ratios to one decimal', () => {
    expect(formatCount(1234567)).toBe('1\u202f234\u202f567');
    expect(formatCount(0)).toBe('0');
    expect(formatCount(Number.NaN)).toBe('—');
    expect(formatPercent(0.0123)).toBe('1.2\u00a0%');
    expect(formatPercent(0)).toBe('0.0\u00a0%');
    expect(formatPercent(Number.NaN)).toBe('—');
  });
});

describe('formatSigned and formatQuantity', () => {
  it('writes signs with a true minus and keeps the unit on the same line', () => {
    expect(formatSigned(1.5, 'dB')).toBe('+1.50\u00a0dB');
    expect(formatSigned(-0.2, 'ms')).toBe('\u22120.20\u00a0ms');
    expect(formatSigned(-0.0001, 'ms')).toBe('0.00\u00a0ms');
    expect(formatSigned(null, 'dB')).toBe('—');
    expect(formatQuantity(3.254, 'm')).toBe('3.25\u00a0m');
    expect(formatQuantity(-30, '°', 1)).toBe('\u221230.0°');
    expect(formatQuantity(undefined, 'm')).toBe('—');
  });
});
