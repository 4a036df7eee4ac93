import request from 'supertest';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('demo seed: Stage 3 planned from its measurements, verified and signed off', () => {
  it('stores "after" measurements and a sign-off whose verdict the verification repeats', async () => {
    const { seedDemoStage3 } = await import('../../seeds/demo-stage3');
    const { seedDemoStage3Measurements } = await import('../../seeds/demo-stage3-stored-measurements');
    const { seedDemoStage3Verification } = await import('../../seeds/demo-stage3-verification');
    const { newId } = await import('../../api/db/ids');
    const ownerId = newId('usr');
    await ctx.db.write((transaction) =>
      ctx.db.models.User.create(
        {
          id: ownerId,
          email: 'dev@kestrel.example',
          name: 'Demo developer',
          role: 'developer',
          passwordHash: null,
          lastSignInAt: null,
        },
        { transaction },
      ),
    );
    await seedDemoStage3(ctx.services);
    await seedDemoStage3Measurements(ctx.services);
    await seedDemoStage3Verification(ctx.services);
    const key = await ctx.addKey('tuning', ownerId);
    const get = (url: string) => request(ctx.app).get(url).set('Authorization', `Bearer ${key}`);
    const room = (await get('/v1/rooms')).body.data[0];
    const tunings = (await get(`/v1/rooms/${room.id}/tunings`)).body.data;
    const planned = tunings.find((t: { name: string }) => t.name === 'Planned from measurements (demo)');
    expect(planned).toMatchObject({ origin: 'plan', version: 1 });
    const verification = (await get(`/v1/tunings/${planned.id}/verification`)).body;
    expect(verification.signOff).toMatchObject({ engineer: 'Demo engineer (invented)', weighting: 'C' });
    expect(verification.signOff.verdict).toBe(verification.verdict);
    expect(verification.arrivalSpread).toMatchObject({ status: 'pass', timingReference: true });
    expect(verification.arrivalSpread.channels).toHaveLength(11);
    for (const c of verification.channels) expect(c.level.status).not.toBe('fail');
    // Printed for the closing note: the demo's figures as they come out.
    console.log(
      JSON.stringify({
        verdict: verification.verdict,
        spreadMs: verification.arrivalSpread.spreadMs,
        channels: verification.channels.map((c: Record<string, Record<string, unknown>>) => [
          c.id,
          c.level.deviationDb,
          c.response.status,
          c.response.rmsDb,
          c.response.largestDb,
          c.response.largestAtHz,
          c.crossoverSum.status,
          c.crossoverSum.deepestDipDb,
        ]),
      }),
    );
    const report = await get(`/v1/rooms/${room.id}/report?tuningId=${planned.id}`);
    expect(report.text).toContain('Demo engineer (invented)');
    expect(report.text).toContain('Responses before and after');
  }, 180_000);
});
