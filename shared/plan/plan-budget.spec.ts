import { CalculationInputError } from '../errors';
import { MAX_PLAN_FITS } from '../limits';
import { requirePlanBudget, requireStoredPlanBudget } from './plan-budget';

const response = { frequenciesHz: [20, 200], magnitudeDb: [0, 0] };
const channels = (withResponse: number, without = 0) => [
  ...Array.from({ length: without }, () => ({})),
  ...Array.from({ length: withResponse }, () => ({ measuredResponse: response })),
];

describe('requirePlanBudget', () => {
  it('takes up to MAX_PLAN_FITS measured responses, however many channels have none', () => {
    expect(() => requirePlanBudget({ channels: channels(MAX_PLAN_FITS, 40) })).not.toThrow();
  });

  it('refuses one response more, naming the first channel over the budget', () => {
    const input = { channels: channels(MAX_PLAN_FITS + 1, 3) };
    let thrown: unknown;
    try {
      requirePlanBudget(input);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(CalculationInputError);
    // Three channels without a response come first, so the 25th response is channel 3 + 24 = 27.
    expect((thrown as CalculationInputError).field).toBe(`/channels/${3 + MAX_PLAN_FITS}/measuredResponse`);
  });
});

describe('requireStoredPlanBudget', () => {
  const ids = (n: number) => Array.from({ length: n }, (_, i) => `C${i + 1}`);

  it('takes up to MAX_PLAN_FITS fitted channels', () => {
    expect(() => requireStoredPlanBudget(ids(MAX_PLAN_FITS))).not.toThrow();
    expect(() => requireStoredPlanBudget([])).not.toThrow();
  });

  it('refuses one more, naming measurements.exclude and the channels over the budget', () => {
    let thrown: unknown;
    try {
      requireStoredPlanBudget(ids(MAX_PLAN_FITS + 2));
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(CalculationInputError);
    expect((thrown as CalculationInputError).field).toBe('/measurements/exclude');
    expect((thrown as Error).message).toContain(
      `over the budget: C${MAX_PLAN_FITS + 1}, C${MAX_PLAN_FITS + 2})`,
    );
  });
});
