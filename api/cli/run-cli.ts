import { ProblemError } from '../http/problem';
import { closeServices, type Services } from '../services';
import { RefusedError, USAGE, UsageError, type CliIo, type OpenServices } from './cli-io';
import { keysCommand } from './keys-commands';
import { usersCommand } from './users-commands';

type Command = (services: Services, args: string[], io: CliIo) => Promise<void>;

const COMMANDS: Record<string, Command> = { keys: keysCommand, users: usersCommand };

function isParseArgsError(err: unknown): err is Error {
  // By its code, not its class: node:util throws its own TypeError, a different class inside test sandboxes.
  const code = (err as NodeJS.ErrnoException | null)?.code;
  return typeof code === 'string' && code.startsWith('ERR_PARSE_ARGS');
}

/**
 * Runs one operator command and answers its exit code: 0 done, 1 refused (no such key, address taken...),
 * 2 wrong arguments.
 */
export async function runCli(argv: string[], io: CliIo, open: OpenServices): Promise<number> {
  const [group, ...rest] = argv;
  if (group === undefined || group === 'help' || group === '--help' || group === '-h') {
    (group === undefined ? io.err : io.out)(USAGE);
    return group === undefined ? 2 : 0;
  }
  const command = COMMANDS[group];
  if (!command) {
    io.err(`Unknown command "${group}".\n\n${USAGE}`);
    return 2;
  }
  let services: Services | undefined;
  try {
    services = await open();
    await command(services, rest, io);
    return 0;
  } catch (err) {
    if (err instanceof UsageError || isParseArgsError(err)) {
      io.err(`${err.message}\n\n${USAGE}`);
      return 2;
    }
    if (err instanceof RefusedError) {
      io.err(err.message);
      return 1;
    }
    if (err instanceof ProblemError) {
      const fields = (err.errors ?? []).map((e) => `  ${e.pointer.replace(/^\/body\//, '')}: ${e.message}`);
      io.err([err.detail ?? err.title, ...fields].join('\n'));
      return 1;
    }
    throw err;
  } finally {
    if (services) await closeServices(services);
  }
}
