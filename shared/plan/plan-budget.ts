import { CalculationInputError } from '../errors';
import { MAX_PLAN_FITS } from '../limits';

/**
 * Refuses a plan that asks for more EQ fits than {@link MAX_PLAN_FITS}, naming the first channel over
 * the budget. Cheap (one pass over the channels), so it runs before any fitting starts.
 */
export function requirePlanBudget(input: { channels: ReadonlyArray<{ measuredResponse?: unknown }> }): void {
  let fits = 0;
  input.channels.forEach((channel, index) => {
    if (channel.measuredResponse === undefined) return;
    fits += 1;
    if (fits > MAX_PLAN_FITS) {
      throw new CalculationInputError(
        `a plan fits EQ to at most ${MAX_PLAN_FITS} measured responses (the channels of the largest ITU-R BS.2051 layout); ` +
          `this is response ${fits}. Plan the room in parts, or leave out the responses of channels that need no EQ.`,
        `/channels/${index}/measuredResponse`,
      );
    }
  });
}

/**
 * The same budget for a plan of a stored room, where the responses come from its measurements rather
 * than the request: refuses when more than {@link MAX_PLAN_FITS} channels would have EQ fitted, naming
 * the override that narrows the choice (`/measurements/exclude`) and the channels over the budget.
 * Runs after the responses are chosen and before any fitting starts.
 */
export function requireStoredPlanBudget(fittedChannels: readonly string[]): void {
  if (fittedChannels.length <= MAX_PLAN_FITS) return;
  const over = fittedChannels.slice(MAX_PLAN_FITS);
  throw new CalculationInputError(
    `a plan fits EQ to at most ${MAX_PLAN_FITS} measured responses (the channels of the largest ITU-R BS.2051 layout); ` +
      `this room's measurements give responses for ${fittedChannels.length} channels (over the budget: ${over.join(', ')}). ` +
      `List the response measurements of channels that need no EQ in measurements.exclude, or choose them with measurements.include.`,
    '/measurements/exclude',
  );
}
