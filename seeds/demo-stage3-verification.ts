import { WaveFile } from 'wavefile';
import { newId } from '../api/db/ids';
import {
  contentFromFile,
  contentFromJson,
  type MeasurementContent,
} from '../api/measurements/measurement-input';
import type { Room } from '../api/db/models/room';
import type { Services } from '../api/services';
import { onThisThread } from '../api/work/heavy-work';
import { storedMeasurement } from '../api/tunings/verification.service';
import { sosfreqz } from '../shared/dsp/response';
import { checkTuningSettings, designTuning, planStoredRoom, planToTuningSettings } from '../shared/plan';
import { findLimitViolations } from '../shared/plan/tuning-limits';
import { promiseOfPlan, verifyTuning, type SignOff } from '../shared/verification';
import { STAGE3_SPL_DB } from './demo-stage3-room';
import { stage3MeasuredResponses, stage3MeasuredResponsesWithPhase } from './demo-stage3-measurements';

/*
 * DEMO DATA — the invented close of the loop in Stage 3 (Kestrel Yard Post is fictional): a tuning planned
 * from the stored measurements, "after" measurements taken with it loaded, and a signed-off verification.
 * The "after" data is made from the tuning the way a processor loaded with it would change the room —
 * every level the reading before plus the trim (with invented reading scatter of a few tenths of a dB),
 * every arrival the time of flight plus the delay in whole samples (captured with a loopback channel, at an
 * invented interface latency), every response the response before through the channel's EQ and crossover,
 * with the subwoofer's low-passed path summed into the bass-managed channels. None of it was measured.
 */

const NOTE = 'Demo data: invented "after" measurement, made from the tuning, not a measurement of anything.';
const TARGETS = { referenceDb: 79, crossoverHz: 80 };
/** Invented reading scatter of the "after" SPL readings, dB (a sound level meter's last digit wanders). */
const SCATTER_DB = [0.1, -0.2, 0, 0.2, -0.1, 0.1, 0, -0.3, 0.2, 0.1, -0.1, 0];
/** Invented interface latency of the "after" captures and where the loopback lands in them, ms. */
const LATENCY_MS = 5.2;
const LOOPBACK_MS = 2;
const SPEED_21C = 343.2 * Math.sqrt(294.15 / 293.15);
const IR_RATE_HZ = 48000;
const RESPONSE_LEVEL_DB = 82;

/** A two-channel capture: the loudspeaker's impulse (with a short invented tail) and the loopback's. */
function capture(arrivalMs: number): Buffer {
  const n = Math.round(0.08 * IR_RATE_HZ);
  const speaker = new Float64Array(n);
  const loop = new Float64Array(n);
  const at = Math.round((arrivalMs * IR_RATE_HZ) / 1000);
  speaker[at] = 0.5;
  for (let i = at + 1; i < n; i++) speaker[i] = 2e-4 * Math.sin(0.37 * i) * Math.exp(-(i - at) / 600);
  loop[Math.round((LOOPBACK_MS * IR_RATE_HZ) / 1000)] = 0.8;
  const wav = new WaveFile();
  wav.fromScratch(2, IR_RATE_HZ, '32f', [Array.from(speaker), Array.from(loop)]);
  return Buffer.from(wav.toBuffer());
}

const storedRoom = (room: Room) => ({
  layoutId: room.layoutId,
  dimensions: room.dimensions,
  listener: room.listener,
  loudspeakers: room.loudspeakers,
  limits: room.limits,
  sampleRateHz: room.sampleRateHz,
});

const meanIn = (f: number[], db: number[], fromHz: number, toHz: number): number => {
  const inBand = db.filter((_, k) => f[k] >= fromHz && f[k] <= toHz);
  return inBand.reduce((a, b) => a + b, 0) / inBand.length;
};

/** Loads the Stage 3 verification demo; runs after the Stage 3 room and its measurements. */
export async function seedDemoStage3Verification(services: Services): Promise<void> {
  const { Room, Measurement, Tuning, TuningVersion } = services.db.models;
  const room = await Room.findOne({ where: { name: 'Stage 3' } });
  if (!room) throw new Error('demo seed: room "Stage 3" is missing; load the Stage 3 room first');
  const rows = await Measurement.findAll({ where: { roomId: room.id }, order: [['id', 'ASC']] });
  const profile = room.profileId ? await services.db.models.ProcessorProfile.findByPk(room.profileId) : null;
  const plan = planStoredRoom(
    { ...storedRoom(room), profile: profile?.settings ?? null },
    rows.map(storedMeasurement),
    {
      targets: TARGETS,
      temperatureC: 21,
    },
  );
  const settings = planToTuningSettings(plan);
  checkTuningSettings(settings);
  const outside = findLimitViolations(settings, room.limits, profile?.settings);
  if (outside.length > 0)
    throw new Error(`demo seed: the planned tuning is outside the limits: ${outside[0].message}`);
  const promise = promiseOfPlan(plan, null);
  const designed = designTuning(settings, settings.sampleRateHz);
  const fs = settings.sampleRateHz;
  const responses = stage3MeasuredResponses();
  const l = room.listener;
  const withPhase = stage3MeasuredResponsesWithPhase(
    Object.fromEntries(room.loudspeakers.map((x) => [x.id, Math.hypot(x.x - l.x, x.y - l.y, x.z - l.z)])),
  );
  const sub = designed.channels.find((c) => c.id === 'LFE1');

  const entries: Array<{ channel: string; micPosition: string; name: string; content: MeasurementContent }> =
    [];
  for (const [i, c] of designed.channels.entries()) {
    entries.push({
      channel: c.id,
      micPosition: 'MLP',
      name: `Demo data — after, SPL ${c.id}`,
      content: contentFromJson({
        kind: 'spl',
        splDb: Math.round((STAGE3_SPL_DB[c.id] + c.trimDb + SCATTER_DB[i % SCATTER_DB.length]) * 10) / 10,
      }),
    });
    if (!c.id.startsWith('LFE')) {
      const speaker = room.loudspeakers.find((x) => x.id === c.id) as { x: number; y: number; z: number };
      const flightMs = (Math.hypot(speaker.x - l.x, speaker.y - l.y, speaker.z - l.z) / SPEED_21C) * 1000;
      const file = capture(LOOPBACK_MS + LATENCY_MS + flightMs + (c.delaySamples / fs) * 1000);
      entries.push({
        channel: c.id,
        micPosition: 'MLP',
        name: `Demo data — after, impulse response ${c.id}`,
        // Start-up work: analysed on this thread rather than by starting worker threads.
        content: await contentFromFile(
          onThisThread,
          { buffer: file, originalname: `demo-after-${c.id}.wav`, mimetype: 'audio/wav', size: file.length },
          { channel: c.id, micPosition: 'MLP', fileChannel: 0, referenceFileChannel: 1, temperatureC: 21 },
          room,
        ),
      });
    }
    const before = responses[c.id];
    if (!before) continue;
    const f = before.frequenciesHz;
    // A path as heard at the listening position: the response before (with its phase and time of flight)
    // through the channel's sections, delay and polarity.
    const path = (ch: (typeof designed.channels)[number]) => {
      const b = withPhase[ch.id];
      const h = sosfreqz(ch.sections, f, fs);
      const sign = ch.polarity === 'inverted' ? -1 : 1;
      return f.map((x, k) => {
        const a = sign * 10 ** (b.magnitudeDb[k] / 20);
        const p = (b.phaseDeg[k] * Math.PI) / 180 - 2 * Math.PI * x * (ch.delaySamples / fs);
        return {
          re: a * (h.re[k] * Math.cos(p) - h.im[k] * Math.sin(p)),
          im: a * (h.re[k] * Math.sin(p) + h.im[k] * Math.cos(p)),
        };
      });
    };
    const db = (z: { re: number; im: number }) => 10 * Math.log10(Math.max(z.re * z.re + z.im * z.im, 1e-12));
    const own = path(c);
    const subPath = sub && c.sections.some((x) => x.stage === 'highPass') ? path(sub) : null;
    // The trims match the subwoofer's pass band to the channel's: its path is scaled so their mean levels
    // (30–60 Hz and 200 Hz–2 kHz) are equal, as the level calibration intends.
    const subGain = subPath
      ? 10 ** ((meanIn(f, own.map(db), 200, 2000) - meanIn(f, subPath.map(db), 30, 60)) / 20)
      : 0;
    const magnitudeDb = f.map((_, k) => {
      const z = subPath
        ? { re: own[k].re + subGain * subPath[k].re, im: own[k].im + subGain * subPath[k].im }
        : own[k];
      // No reading falls below the measurement's noise floor, 120 dB under the pass band.
      return Math.round((RESPONSE_LEVEL_DB + db(z)) * 100) / 100;
    });
    entries.push({
      channel: c.id,
      micPosition: 'MLP',
      name: `Demo data — after, response ${c.id}`,
      content: contentFromJson({
        kind: 'frequencyResponse',
        response: { frequenciesHz: before.frequenciesHz, magnitudeDb },
      }),
    });
  }

  await services.db.write(async (transaction) => {
    const tuning = await Tuning.create(
      {
        id: newId('tun'),
        roomId: room.id,
        ownerId: room.ownerId,
        name: 'Planned from measurements (demo)',
        currentVersion: 1,
        duplicatedFromId: null,
      },
      { transaction },
    );
    const version = await TuningVersion.create(
      {
        id: newId('tver'),
        tuningId: tuning.id,
        version: 1,
        name: tuning.name,
        notes: 'Demo data: planned from the invented stored measurements of Stage 3.',
        sampleRateHz: settings.sampleRateHz,
        channels: settings.channels,
        subwoofer: settings.subwoofer,
        origin: 'plan',
        restoredFromVersion: null,
        promise,
        roomRevision: room.stateRevision,
        createdByUserId: room.ownerId,
        createdByKeyId: null,
      },
      { transaction },
    );
    const after = [];
    for (const entry of entries) {
      after.push(
        await Measurement.create(
          {
            id: newId('meas'),
            roomId: room.id,
            ownerId: room.ownerId,
            channel: entry.channel,
            micPosition: entry.micPosition,
            name: entry.name,
            notes: NOTE,
            ...entry.content,
            tuningId: tuning.id,
            tuningVersion: 1,
            stage: 'after',
            createdByKeyId: null,
          },
          { transaction },
        ),
      );
    }
    const verdict = verifyTuning({ settings, promise, after: after.map(storedMeasurement) }).verdict;
    const signOff: SignOff = {
      engineer: 'Demo engineer (invented)',
      date: '2026-03-03',
      referenceLevelDb: TARGETS.referenceDb,
      weighting: 'C',
      microphone: 'Demo measurement microphone, serial 0001 (invented)',
      positions: ['MLP'],
      notes:
        'Demo data: an invented sign-off of the invented "after" measurements. Signed with the cancellations that cut-only EQ cannot fill noted (the left channel near 115 Hz, the subwoofer near 71 Hz): the loudspeaker positions are fixed by the console and the machine-room wall.',
      verdict,
      signedAt: '2026-03-03T17:30:00.000Z',
    };
    await version.update({ signOff }, { transaction });
  });
}
