import { Outbox } from './outbox';

const message = (n: number) => ({
  to: `person${n}@test.example`,
  subject: `Message ${n}`,
  text: `Body ${n}`,
});

describe('Outbox', () => {
  it('lists newest first and pages with startingAfter', () => {
    const outbox = new Outbox(10);
    for (let n = 1; n <= 5; n++) outbox.add(message(n));
    const first = outbox.list(2);
    expect(first.data.map((m) => m.subject)).toEqual(['Message 5', 'Message 4']);
    expect(first.hasMore).toBe(true);
    const second = outbox.list(2, first.data[1].id);
    expect(second.data.map((m) => m.subject)).toEqual(['Message 3', 'Message 2']);
    const last = outbox.list(2, second.data[1].id);
    expect(last).toEqual({ data: [expect.objectContaining({ subject: 'Message 1' })], hasMore: false });
  });

  it('drops the oldest messages beyond its capacity', () => {
    const outbox = new Outbox(3);
    for (let n = 1; n <= 5; n++) outbox.add(message(n));
    expect(outbox.size).toBe(3);
    expect(outbox.list(10).data.map((m) => m.subject)).toEqual(['Message 5', 'Message 4', 'Message 3']);
  });

  it('answers an unknown cursor with an empty page rather than starting over', () => {
    const outbox = new Outbox();
    outbox.add(message(1));
    expect(outbox.list(10, 'msg_gone')).toEqual({ data: [], hasMore: false });
  });

  it('stamps each message with an id and the time it arrived', () => {
    const outbox = new Outbox(5, () => new Date('2026-03-02T10:00:00.000Z'));
    const stored = outbox.add(message(1));
    expect(stored.id).toMatch(/^msg_/);
    expect(stored.sentAt).toBe('2026-03-02T10:00:00.000Z');
  });
});

describe('Outbox size limit', () => {
  it('drops the oldest messages once the text it holds passes its byte limit', () => {
    const outbox = new Outbox(100, () => new Date(), 10_000);
    const big = (n: number) => ({ to: 'a@test.example', subject: `Big ${n}`, text: 'x'.repeat(3000) });
    for (let n = 1; n <= 6; n++) outbox.add(big(n));
    expect(outbox.sizeBytes).toBeLessThanOrEqual(10_000);
    expect(outbox.list(10).data.map((m) => m.subject)).toEqual(['Big 6', 'Big 5', 'Big 4']);
  });
});
