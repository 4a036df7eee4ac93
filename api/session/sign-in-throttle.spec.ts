import { GrowingDelayThrottle } from './sign-in-throttle';

const limits = { freeFailures: 3, firstDelayMs: 1000, maxDelayMs: 8000, forgetAfterMs: 60_000 };

describe('GrowingDelayThrottle', () => {
  it('lets the free failures pass, then doubles the wait with each failure up to the ceiling', () => {
    let now = 0;
    const throttle = new GrowingDelayThrottle(limits, () => now);
    const waits: number[] = [];
    for (let i = 0; i < 8; i++) {
      throttle.fail('k');
      waits.push(throttle.waitMs('k'));
      now += throttle.waitMs('k');
    }
    expect(waits).toEqual([0, 0, 0, 1000, 2000, 4000, 8000, 8000]);
  });

  it('keeps keys apart', () => {
    const throttle = new GrowingDelayThrottle(limits, () => 0);
    for (let i = 0; i < 5; i++) throttle.fail('attacker');
    expect(throttle.waitMs('attacker')).toBe(2000);
    expect(throttle.waitMs('user')).toBe(0);
  });

  it('forgets a key after a quiet spell, and at once on success', () => {
    let now = 0;
    const throttle = new GrowingDelayThrottle(limits, () => now);
    for (let i = 0; i < 4; i++) throttle.fail('k');
    expect(throttle.waitMs('k')).toBe(1000);
    now += 60_001;
    throttle.fail('k');
    expect(throttle.waitMs('k')).toBe(0);
    for (let i = 0; i < 4; i++) throttle.fail('k');
    expect(throttle.waitMs('k')).toBeGreaterThan(0);
    throttle.succeed('k');
    expect(throttle.waitMs('k')).toBe(0);
  });

  it('takes back a failure counted in advance, lifting the wait below the free count', () => {
    const throttle = new GrowingDelayThrottle(limits, () => 0);
    for (let i = 0; i < 4; i++) throttle.fail('k');
    expect(throttle.waitMs('k')).toBe(1000);
    throttle.forgive('k');
    expect(throttle.waitMs('k')).toBe(0);
  });
});
