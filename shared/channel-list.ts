import { CalculationInputError } from './errors';
import { MAX_CHANNELS } from './limits';

export { MAX_CHANNELS };

/**
 * Checks a request's channel list: 1 to 128 entries, each with a non-empty `id` (the channel's
 * BS.2051 label) used only once. Errors name `/channels` or the offending `/channels/i/id`.
 */
export function requireChannelList<T extends { id: string }>(channels: T[]): T[] {
  if (!Array.isArray(channels) || channels.length === 0 || channels.length > MAX_CHANNELS) {
    throw new CalculationInputError(`channels must list 1 to ${MAX_CHANNELS} channels`, '/channels');
  }
  const seen = new Set<string>();
  channels.forEach((channel, i) => {
    if (typeof channel?.id !== 'string' || channel.id.length === 0) {
      throw new CalculationInputError('id must be a non-empty string', `/channels/${i}/id`);
    }
    if (seen.has(channel.id)) {
      throw new CalculationInputError(`id ${channel.id} appears more than once`, `/channels/${i}/id`);
    }
    seen.add(channel.id);
  });
  return channels;
}
