/**
 * Reads until the check passes or 15 s have gone: a click returns once its event is dispatched, and
 * what it changes is drawn at a later render or after an answer from the service.
 */
export async function eventually<T>(read: () => Promise<T>, check: (value: T) => void): Promise<void> {
  const deadline = Date.now() + 15_000;
  for (;;) {
    const value = await read();
    try {
      check(value);
      return;
    } catch (error) {
      if (Date.now() > deadline) throw error;
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
