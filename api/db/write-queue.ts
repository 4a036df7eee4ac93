/**
 * SQLite allows one writer at a time, and Sequelize opens a new connection per transaction, so racing
 * transactions fail with SQLITE_BUSY instead of waiting. Every write goes through this one in-process
 * queue: transactions run one after another, short, and never fight.
 */
export class WriteQueue {
  private tail: Promise<unknown> = Promise.resolve();
  private pending = 0;

  run<T>(work: () => Promise<T>): Promise<T> {
    this.pending += 1;
    const result = this.tail.then(work);
    this.tail = result.then(
      () => this.done(),
      () => this.done(),
    );
    return result;
  }

  /** Resolves once every write queued so far has finished. */
  async drain(): Promise<void> {
    while (this.pending > 0) await this.tail;
  }

  private done(): void {
    this.pending -= 1;
  }
}
