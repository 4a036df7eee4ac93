import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { loadConfig } from '../../api/config';
import { startupWarnings } from '../../api/lifecycle/startup-warnings';
import { startService, STARTS_THE_SERVICE_MS } from '../support/service-process';
import { createTestContext } from '../support/test-context';

describe('a start without NODE_ENV', () => {
  it(
    'says loudly that it is not production: demo password, cookies without Secure, open mail server',
    async () => {
      const dir = mkdtempSync(path.join(tmpdir(), 'isochron-dev-start-'));
      const service = await startService(`sqlite:${path.join(dir, 'dev.sqlite')}`, dir, {
        NODE_ENV: '',
        SEED_DEMO_DATA: 'true',
      });
      try {
        for (let i = 0; i < 200 && !service.output().includes('NOT set up for production'); i++) {
          await new Promise((resolve) => setTimeout(resolve, 50));
        }
        const banner = service.output();
        expect(banner).toContain('Isochron is NOT set up for production');
        expect(banner).toContain('NODE_ENV is development (not set)');
        expect(banner).toContain('without the Secure flag');
        expect(banner).toMatch(
          /development mail server runs on 127\.0\.0\.1 and accepts mail from any local process/,
        );
        expect(banner).toContain(
          'admin@kestrel.example, dev@kestrel.example, viewer@kestrel.example sign in with the published demo password "kestrel-demo"',
        );
      } finally {
        expect(await service.stop()).toBe(0);
        rmSync(dir, { recursive: true, force: true });
      }
    },
    STARTS_THE_SERVICE_MS,
  );
});

describe('a production start', () => {
  it('has nothing to warn about when no demo account keeps the demo password', async () => {
    const ctx = await createTestContext();
    try {
      const production = loadConfig({
        NODE_ENV: 'production',
        DATABASE_URL: ctx.services.config.databaseUrl,
        ISOCHRON_KEY_HASH_SECRET: 'x'.repeat(32),
        ISOCHRON_SESSION_SECRET: 'y'.repeat(32),
      });
      expect(await startupWarnings(production, ctx.db.models, { outbox: null })).toEqual([]);
    } finally {
      await ctx.close();
    }
  });
});
