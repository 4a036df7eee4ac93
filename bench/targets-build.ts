import { execFileSync } from 'node:child_process';
import path from 'node:path';

const ROOT = path.join(__dirname, '..');

/** How to start a target server (a script of bench/targets/) in its own process. */
export interface TargetLauncher {
  /** The file to fork for `script` (its name in bench/targets/, e.g. `full-chain.ts`). */
  file(script: string): string;
  /** Node options the forked process needs. */
  execArgv: string[];
  /** What the report says the targets ran from. */
  from: string;
}

/**
 * The target servers run as the service runs in production (`npm start`): the JavaScript tsc builds,
 * here compiled once per bench run into dist/bench (tsconfig.bench.json: the server's sources and
 * bench/targets). Every target runs the same way, so the comparisons stay fair either way, but the
 * sources run through tsx carry its transform's own work (a `__name()` call for each named function
 * or class as it is created, the loader's hooks), which is not the service's cost.
 * `BENCH_FROM_SOURCE=1` runs the TypeScript sources through tsx instead (no build; as the tests do).
 */
export function prepareTargets(): TargetLauncher {
  if (process.env.BENCH_FROM_SOURCE === '1') {
    return {
      file: (script) => path.join(__dirname, 'targets', script),
      execArgv: ['--import', 'tsx'],
      from: 'TypeScript sources through tsx (BENCH_FROM_SOURCE=1)',
    };
  }
  process.stdout.write('Building the targets (tsc -p tsconfig.bench.json)…\n');
  execFileSync(process.execPath, [require.resolve('typescript/bin/tsc'), '-p', 'tsconfig.bench.json'], {
    cwd: ROOT,
    stdio: 'inherit',
  });
  return {
    file: (script) => path.join(ROOT, 'dist', 'bench', 'bench', 'targets', script.replace(/\.ts$/, '.js')),
    execArgv: [],
    from: 'the built JavaScript (dist/bench)',
  };
}
