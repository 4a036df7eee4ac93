import { createApp } from './app';
import { createServer, listen } from './http/server';
import { ConfigError, loadConfig, sqliteStorage } from './config';
import { describeStorageFailure } from './db/storage-errors';
import { gracefulShutdown } from './lifecycle/graceful-shutdown';
import { startupWarnings, warningBanner } from './lifecycle/startup-warnings';
import { loadDemoData } from '../seeds';
import { closeServices, createServices } from './services';

async function main(): Promise<void> {
  const config = loadConfig();
  const services = await createServices(config);
  // Instances starting together on one PostgreSQL database: one seeds, the others find it filled.
  if (config.seedDemoData) await services.db.exclusively(() => loadDemoData(services));
  const app = createApp(services);
  const server = listen(createServer(app), config.port, undefined, (error?: Error) => {
    if (error) {
      services.logger.error({ err: error }, `cannot listen on port ${config.port}`);
      process.exit(1);
    }
    services.logger.info(`Isochron listening on http://localhost:${config.port} (console /, docs /docs)`);
  });
  const warnings = await startupWarnings(config, services.db.models, services.mail);
  for (const warning of warnings) services.logger.warn(warning);
  if (warnings.length > 0) console.error(warningBanner(warnings));

  const shutdown = gracefulShutdown(server, {
    deadlineMs: config.shutdownDeadlineMs,
    log: (message) => services.logger.info(message),
    close: () => closeServices(services),
  });
  const stop = (signal: string) => {
    if (shutdown.stopping) return;
    // If closing itself hangs (a stuck disk), do not outlive the deadline by much.
    setTimeout(() => {
      services.logger.error('shutdown did not finish; exiting');
      process.exit(1);
    }, config.shutdownDeadlineMs + 5000).unref();
    shutdown.stop(signal).then(
      () => process.exit(0),
      (err) => {
        services.logger.error({ err }, 'shutdown failed');
        process.exit(1);
      },
    );
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

main().catch((err) => {
  if (err instanceof ConfigError) {
    console.error(`Configuration error: ${err.message}`);
  } else {
    let storage: string | null = null;
    try {
      storage = sqliteStorage(process.env.DATABASE_URL || 'sqlite:data/isochron.sqlite');
    } catch {
      // The URL itself is wrong; loadConfig said so already.
    }
    const message = describeStorageFailure(err, storage);
    if (message) console.error(`Isochron cannot start. ${message}`);
    else console.error(err);
  }
  process.exit(1);
});
