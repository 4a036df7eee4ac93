import type { Request, RequestHandler } from 'express';
import type { Logger } from '../logger';
import type { Config } from '../config';
import type { Database } from '../db/database';
import { MemoryUsageBuffer, RedisUsageBuffer, type UsageBuffer } from './usage-buffer';
import { UsageCounter } from './usage-counter';
import type { SharedState } from '../shared-state/shared-state';
import { DatabaseUsageSink, type UsageSink } from './usage-sink';

/**
 * The route a request matched, as its template in the OpenAPI spelling (`GET /v1/keys/{keyId}`), so
 * that usage is grouped by operation and never keeps raw ids. Routers under `/v1` register full paths
 * relative to their mount point. A request no route matched is counted as `(no route)`.
 */
export function routeTemplate(req: Request, mountPath: string): string {
  const path: unknown = req.route?.path;
  if (typeof path !== 'string') return `${req.method} ${mountPath} (no route)`;
  const raw = `${req.method} ${mountPath}${path}`;
  let template = templates.get(raw);
  if (template === undefined) {
    template = raw.replace(/:(\w+)/g, '{$1}');
    templates.set(raw, template);
  }
  return template;
}

// Registered routes are few and fixed, so this stays small; it saves a regular expression per call.
const templates = new Map<string, string>();

export interface UsageMeterOptions {
  sink: UsageSink;
  /** Where counts wait for the flush: this process's memory by default, or Redis. */
  buffer?: UsageBuffer;
  flushIntervalMs: number;
  logger: Logger;
  now?: () => number;
}

/**
 * Counts every authenticated call when its response has been sent (`finish`), in memory or in Redis
 * (shared by the instances), and writes the counts in one transaction every `flushIntervalMs` and on
 * close. A failed flush keeps its counts for the next one.
 */
export class UsageMeter {
  readonly counter = new UsageCounter();
  private readonly buffer: UsageBuffer;
  private readonly timer: NodeJS.Timeout;
  private flushing: Promise<void> = Promise.resolve();
  private closed = false;
  private readonly now: () => number;

  constructor(private readonly options: UsageMeterOptions) {
    this.now = options.now ?? Date.now;
    this.buffer = options.buffer ?? new MemoryUsageBuffer(this.counter);
    this.timer = setInterval(() => {
      this.flush().catch(() => undefined);
    }, options.flushIntervalMs);
    this.timer.unref();
  }

  /** Mount after authentication: it needs `req.principal`. */
  readonly middleware: RequestHandler = (req, res, next) => {
    const principal = req.principal;
    if (principal) {
      const mountPath = req.baseUrl;
      // 'finish' comes once per response: `on` spares the wrapper `once` builds per request.
      res.on('finish', () => {
        this.buffer.record(
          principal.keyId ?? '',
          principal.userId,
          routeTemplate(req, mountPath),
          res.statusCode,
          this.now(),
        );
      });
    }
    next();
  };

  /** Writes everything counted so far. Flushes run one after another, never side by side. */
  flush(): Promise<void> {
    const run = this.flushing.then(() => this.writeBatch());
    this.flushing = run.catch(() => undefined);
    return run;
  }

  /** Stops the timer and writes the rest. Call once no more requests are coming (after the server closed). */
  async close(): Promise<void> {
    if (this.closed) return this.flushing;
    this.closed = true;
    clearInterval(this.timer);
    await this.flush();
  }

  private async writeBatch(): Promise<void> {
    const batch = await this.buffer.take();
    if (batch.counts.length === 0 && batch.lastUsedAt.size === 0) return;
    try {
      await this.options.sink.write(batch);
      this.options.logger.debug({ buckets: batch.counts.length }, 'usage flushed');
    } catch (err) {
      await this.buffer.giveBack(batch);
      this.options.logger.error(
        { err, buckets: batch.counts.length },
        'usage flush failed; kept for the next flush',
      );
      throw err;
    }
  }
}

/** The process's meter on the services' database. Call `close()` on shutdown, before the database closes. */
export function createUsageMeter(
  db: Database,
  config: Pick<Config, 'usageFlushIntervalMs'>,
  logger: Logger,
  shared?: SharedState,
): UsageMeter {
  return new UsageMeter({
    sink: new DatabaseUsageSink(db),
    buffer: shared?.redis ? new RedisUsageBuffer(shared.redis, `${shared.prefix}usage:buffer`) : undefined,
    flushIntervalMs: config.usageFlushIntervalMs,
    logger,
  });
}
