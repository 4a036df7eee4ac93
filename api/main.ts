import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { loadDemoData } from '../seeds';
import { closeServices, createServices } from './services';

async function main(): Promise<void> {
  const config = loadConfig();
  const services = await createServices(config);
  if (config.seedDemoData) await loadDemoData(services);
  const app = createApp(services);
  const server = app.listen(config.port, (error?: Error) => {
    if (error) {
      services.logger.error({ err: error }, `cannot listen on port ${config.port}`);
      process.exit(1);
    }
    services.logger.info(`Isochron listening on http://localhost:${config.port} (console /, docs /docs)`);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    services.logger.info(`${signal}: finishing requests, then closing`);
    server.close(() => {
      closeServices(services).then(
        () => process.exit(0),
        (err) => {
          services.logger.error({ err }, 'shutdown failed');
          process.exit(1);
        },
      );
    });
    server.closeIdleConnections();
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

main().catch((err) => {
  if (err instanceof ConfigError) {
    console.error(`Configuration error: ${err.message}`);
  } else {
    console.error(err);
  }
  process.exit(1);
});
