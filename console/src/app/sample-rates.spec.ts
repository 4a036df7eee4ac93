import { DEFAULT_SAMPLE_RATE_HZ, SAMPLE_RATE_MAX_HZ, SAMPLE_RATE_MIN_HZ } from '../../../shared/limits';
import { COMMON_SAMPLE_RATES_HZ } from './sample-rates';

describe('COMMON_SAMPLE_RATES_HZ', () => {
  it('offers only rates the contract accepts, in ascending order', () => {
    for (const rate of COMMON_SAMPLE_RATES_HZ) {
      expect(rate).toBeGreaterThanOrEqual(SAMPLE_RATE_MIN_HZ);
      expect(rate).toBeLessThanOrEqual(SAMPLE_RATE_MAX_HZ);
    }
    expect([...COMMON_SAMPLE_RATES_HZ].sort((a, b) => a - b)).toEqual([...COMMON_SAMPLE_RATES_HZ]);
  });

  it('offers the default rate, which a new room starts with', () => {
    expect(COMMON_SAMPLE_RATES_HZ).toContain(DEFAULT_SAMPLE_RATE_HZ);
  });
});
