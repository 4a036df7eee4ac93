import { CalculationInputError } from '../errors';
import { MAX_PLAN_FITS } from '../limits';
import { requirePlanBudget } from './plan-budget';

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
