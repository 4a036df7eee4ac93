import { CalculationInputError } from './errors';

/** Most channels one calculation accepts. */
export const MAX_CHANNELS = 128;

/**
 * Checks a request's channel list: 1 to 128 entries, each with a non-empty label used only once.
 * Errors name `/channels` or the offending `/channels/i/label`.
 */
export function requireChannelList<T extends { label: string }>(channels: T[]): T[] {
  if (!Array.isArray(channels) || channels.length === 0 || channels.length > MAX_CHANNELS) {
    throw new CalculationInputError(`channels must list 1 to ${MAX_CHANNELS} channels`, '/channels');
  }
  const seen = new Set<string>();
  channels.forEach((channel, i) => {
    if (typeof channel?.label !== 'string' || channel.label.length === 0) {
      throw new CalculationInputError('label must be a non-empty string', `/channels/${i}/label`);
    }
    if (seen.has(channel.label)) {
      throw new CalculationInputError(
        `label ${channel.label} appears more than once`,
        `/channels/${i}/label`,
      );
    }
    seen.add(channel.label);
  });
  return channels;
}
