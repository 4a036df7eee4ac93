import { ConfigError, loadConfig } from '../config';
import { createServices } from '../services';
import { runCli } from './run-cli';

// The operator command line: `npm run isochron -- keys create --name N --role R`. Same database and
// secrets as the service; quiet logs unless LOG_LEVEL says otherwise.
const io = { out: (line: string) => console.log(line), err: (line: string) => console.error(line) };

runCli(process.argv.slice(2), io, () =>
  createServices(loadConfig({ ...process.env, LOG_LEVEL: process.env.LOG_LEVEL || 'warn' })),
).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    console.error(err instanceof ConfigError ? `Configuration error: ${err.message}` : err);
    process.exitCode = 1;
  },
);
