import type { components } from '../../shared/contract/api-types';
import { newId } from '../db/ids';
import { pageOfList, type Page } from '../db/pagination';

/** A message as the local fake mail server received it (the contract's `OutboxMessage`). */
export type OutboxMessage = components['schemas']['OutboxMessage'];

/** How many messages the outbox keeps; older ones drop off so a long development session stays small. */
export const OUTBOX_CAPACITY = 200;
/**
 * How many bytes of text the outbox keeps in all. Any local process may send to the development mail
 * server, so memory is bounded by bytes as well as by count; older messages drop off first.
 */
export const OUTBOX_MAX_BYTES = 1024 * 1024;

const sizeOf = (m: Pick<OutboxMessage, 'to' | 'subject' | 'text'>): number =>
  Buffer.byteLength(m.to) + Buffer.byteLength(m.subject) + Buffer.byteLength(m.text);

/** Messages received by the development mail server, newest first. Memory only: a restart empties it. */
export class Outbox {
  private readonly messages: OutboxMessage[] = [];
  private bytes = 0;

  constructor(
    private readonly capacity = OUTBOX_CAPACITY,
    private readonly now: () => Date = () => new Date(),
    private readonly maxBytes = OUTBOX_MAX_BYTES,
  ) {}

  add(message: Omit<OutboxMessage, 'id' | 'sentAt'>): OutboxMessage {
    const stored = { id: newId('msg'), ...message, sentAt: this.now().toISOString() };
    this.messages.unshift(stored);
    this.bytes += sizeOf(stored);
    while (this.messages.length > 1 && (this.messages.length > this.capacity || this.bytes > this.maxBytes)) {
      const dropped = this.messages.pop();
      if (dropped) this.bytes -= sizeOf(dropped);
    }
    return stored;
  }

  /** Bytes of text held now. */
  get sizeBytes(): number {
    return this.bytes;
  }

  /** One page, newest first; `startingAfter` is the id of the last message of the previous page. */
  list(limit: number, startingAfter?: string): Page<OutboxMessage> {
    return pageOfList(this.messages, (m) => m.id, { limit, startingAfter });
  }

  get size(): number {
    return this.messages.length;
  }
}
