import { newId } from '../db/ids';
import { pageOfList, type Page } from '../db/pagination';

/** A message as the local fake mail server received it. */
export interface OutboxMessage {
  id: string;
  to: string;
  subject: string;
  text: string;
  sentAt: string;
}

/** How many messages the outbox keeps; older ones drop off so a long development session stays small. */
export const OUTBOX_CAPACITY = 200;

/** Messages received by the development mail server, newest first. Memory only: a restart empties it. */
export class Outbox {
  private readonly messages: OutboxMessage[] = [];

  constructor(
    private readonly capacity = OUTBOX_CAPACITY,
    private readonly now: () => Date = () => new Date(),
  ) {}

  add(message: Omit<OutboxMessage, 'id' | 'sentAt'>): OutboxMessage {
    const stored = { id: newId('msg'), ...message, sentAt: this.now().toISOString() };
    this.messages.unshift(stored);
    if (this.messages.length > this.capacity) this.messages.length = this.capacity;
    return stored;
  }

  /** One page, newest first; `startingAfter` is the id of the last message of the previous page. */
  list(limit: number, startingAfter?: string): Page<OutboxMessage> {
    return pageOfList(this.messages, (m) => m.id, { limit, startingAfter });
  }

  get size(): number {
    return this.messages.length;
  }
}
