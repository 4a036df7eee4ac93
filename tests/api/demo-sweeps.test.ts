import request from 'supertest';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('demo seed: the demo microphone and Stage 3 measured by sweeps', () => {
  it('stores every channel as a corrected sweep measurement whose delay is the time of flight', async () => {
    const { seedDemoStage3Sweeps, demoFlightSamples, DEMO_MICROPHONE } =
      await import('../../seeds/demo-stage3-sweeps');
    const { STAGE3_ROOM } = await import('../../seeds/demo-stage3-room');
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
    await seedDemoStage3Sweeps(ctx.services);
    const key = await ctx.addKey('tuning', ownerId);
    const get = (url: string) => request(ctx.app).get(url).set('Authorization', `Bearer ${key}`);

    const mics = (await get('/v1/microphones')).body.data;
    expect(mics).toHaveLength(1);
    expect(mics[0]).toMatchObject({
      name: DEMO_MICROPHONE.name,
      serial: 'KY-0417',
      splOffset: { offsetDb: 126.5 },
    });
    expect(mics[0].calibration.points).toBe(12);

    const room = (await get('/v1/rooms')).body.data.find((r: { name: string }) => r.name.includes('sweeps'));
    const list = (await get(`/v1/rooms/${room.id}/measurements?limit=100`)).body.data;
    expect(list.map((m: { channel: string }) => m.channel).sort()).toEqual(
      STAGE3_ROOM.loudspeakers.map((l) => l.id).sort(),
    );
    for (const summary of list) {
      const m = (await get(`/v1/rooms/${room.id}/measurements/${summary.id}`)).body;
      expect(m.source).toMatchObject({ fileKind: 'sweepRecording', channelCount: 2 });
      // Delay counted from the loopback: the time of flight from the room's geometry (a fractional number
      // of samples); the peaks within one sample of it, the onsets (20 dB under each peak, ISO 3382-1
      // Annex A) within three, as the fractional delay spreads the band-limited peak over its neighbours.
      const flightMs = (demoFlightSamples(m.channel) / 48000) * 1000;
      expect(Math.abs(m.result.timing.peakFromReferenceMs - flightMs)).toBeLessThanOrEqual(1000 / 48000);
      expect(Math.abs(m.summary.arrivalFromReferenceMs - flightMs)).toBeLessThanOrEqual(3000 / 48000);
      expect(m.result.microphone).toMatchObject({
        id: mics[0].id,
        correctionApplied: true,
        splOffsetDb: 126.5,
      });
      expect(m.result.frequencyResponse.splDb).toHaveLength(m.result.frequencyResponse.magnitudeDb.length);
    }
    // Twelve sweeps are analysed while seeding: a generous cap for a busy machine (not a timing check).
  }, 120000);
});
