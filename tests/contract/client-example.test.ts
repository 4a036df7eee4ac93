import { readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { Server } from 'node:http';
import { example } from '../../client/example';
import { createIsochronClient } from '../../client';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
let server: Server;
let baseUrl: string;

beforeAll(async () => {
  ctx = await createTestContext();
  server = ctx.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
});

const root = path.join(__dirname, '..', '..', 'client');

describe('the integrator client (client/)', () => {
  it('shows client/example.ts exactly in client/README.md', () => {
    const readme = readFileSync(path.join(root, 'README.md'), 'utf8');
    const source = readFileSync(path.join(root, 'example.ts'), 'utf8').trimEnd();
    const blocks = [...readme.matchAll(/```ts\n([\s\S]*?)\n```/g)].map((m) => m[1]);
    expect(blocks).toContain(source);
  });

  it('runs the README example against the real service', async () => {
    const lines = await example(baseUrl, ctx.keys.calculate);
    // LFE1 arrives last (10.6 ms), so it is the reference with no delay; the others wait for it.
    expect(lines[2]).toBe('LFE1: 0.000 ms (0 samples)');
    expect(lines[0]).toMatch(/^M\+030: \d\.\d{3} ms \(\d+ samples\)$/);
    expect(lines[3]).toMatch(
      /^63 Hz cut: b = \[[-\d.e]+, [-\d.e]+, [-\d.e]+\], a = \[1, [-\d.e]+, [-\d.e]+\]$/,
    );
  });

  it('hands back the problem document of a refusal, naming the field', async () => {
    const isochron = createIsochronClient({ baseUrl, apiKey: ctx.keys.calculate });
    const { data, error, response } = await isochron.POST('/v1/delays', {
      body: { channels: [{ id: 'M+030', distance: 3 }], temperatureC: 99 },
    });
    expect(data).toBeUndefined();
    expect(response.status).toBe(400);
    expect(error?.errors?.map((e) => e.pointer)).toEqual(['/body/temperatureC']);
  });

  it('sends the key only in the Authorization header', async () => {
    const isochron = createIsochronClient({ baseUrl, apiKey: 'iso_live_' + 'x'.repeat(43) });
    const { response } = await isochron.GET('/v1/layouts');
    expect(response.status).toBe(401);
  });
});
