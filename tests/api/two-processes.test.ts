import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openDatabase } from '../../api/db/database';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { burst, type BurstOutcome, type BurstRequest } from '../support/http-burst';
import {
  databaseWithKeys,
  startService,
  type ServiceProcess,
  STARTS_THE_SERVICE_MS,
} from '../support/service-process';

const EDITS_PER_PROCESS = 60;

async function post(port: number, key: string, route: string, body: unknown): Promise<{ id: string }> {
  const [outcome] = await burst(port, [
    { method: 'POST', path: route, headers: { Authorization: `Bearer ${key}` }, body },
  ]);
  if (!('status' in outcome) || outcome.status !== 201)
    throw new Error(`${route}: ${JSON.stringify(outcome)}`);
  return JSON.parse(outcome.body!) as { id: string };
}

describe('two service processes on one SQLite file', () => {
  it(
    'race tuning edits without a 500: each edit gets its own version, or 503 with Retry-After',
    async () => {
      const dir = mkdtempSync(path.join(tmpdir(), 'isochron-two-'));
      const databaseUrl = `sqlite:${path.join(dir, 'shared.sqlite')}`;
      const services: ServiceProcess[] = [];
      try {
        const { secrets } = await databaseWithKeys(databaseUrl, { role: 'tuning', count: 2 });
        // One after the other, so that only one of them migrates the new file.
        services.push(await startService(databaseUrl, dir));
        services.push(await startService(databaseUrl, dir));
        const [a, b] = services;

        const room = await post(a.port, secrets[0], '/v1/rooms', structuredClone(STAGE3_ROOM));
        const tuning = await post(b.port, secrets[1], `/v1/rooms/${room.id}/tunings`, {
          name: 'Race',
          channels: [{ id: 'M+030', delayMs: 0, trimDb: 0 }],
        });
        const edits = (key: string): BurstRequest[] =>
          Array.from({ length: EDITS_PER_PROCESS }, (_, i) => ({
            method: 'PATCH',
            path: `/v1/tunings/${tuning.id}`,
            headers: { Authorization: `Bearer ${key}` },
            body: { channels: [{ id: 'M+030', trimDb: -(i % 12) }] },
          }));
        const outcomes: BurstOutcome[] = (
          await Promise.all([
            burst(a.port, edits(secrets[0]), { sockets: 16 }),
            burst(b.port, edits(secrets[1]), { sockets: 16 }),
          ])
        ).flat();

        const statuses = outcomes.map((o) => ('status' in o ? o.status : o.error));
        expect(statuses.filter((s) => s !== 200 && s !== 503)).toEqual([]);
        for (const o of outcomes) {
          if ('status' in o && o.status === 503) expect(Number(o.headers!['retry-after'])).toBeGreaterThan(0);
        }
        const versions = outcomes
          .filter((o) => 'status' in o && o.status === 200)
          .map((o) => JSON.parse((o as { body: string }).body).version as number);
        expect(new Set(versions).size).toBe(versions.length);

        const db = await openDatabase(databaseUrl);
        try {
          const stored = await db.models.Tuning.findByPk(tuning.id);
          expect(stored!.currentVersion).toBe(1 + versions.length);
          expect(await db.models.TuningVersion.count({ where: { tuningId: tuning.id } })).toBe(
            1 + versions.length,
          );
        } finally {
          await db.close();
        }
        const retries = services.map((s) => (s.output().match(/database busy/g) ?? []).length);
        // Measured numbers for the report (not asserted: they depend on the machine's load).
        console.log(
          `two processes, ${2 * EDITS_PER_PROCESS} edits: ${versions.length} stored, ` +
            `${statuses.filter((s) => s === 503).length} answered 503, busy retries ${retries.join(' + ')}`,
        );
      } finally {
        for (const service of services) expect(await service.stop()).toBe(0);
        rmSync(dir, { recursive: true, force: true });
      }
    },
    STARTS_THE_SERVICE_MS,
  );
});
