import { WaveFile } from 'wavefile';
import { newId } from '../api/db/ids';
import { contentFromFile, type MeasurementContent } from '../api/measurements/measurement-input';
import { correctedBy } from '../api/measurements/measurements.service';
import { recordRoomState } from '../api/rooms/room-state-store';
import type { Services } from '../api/services';
import { onThisThread } from '../api/work/heavy-work';
import { seededGaussian } from '../shared/analysis/test-signals';
import { parseCalibrationText } from '../shared/capture/microphone';
import { exponentialSweep, type SweepSpec } from '../shared/capture/sweep';
import { checkRoomDefinition } from '../shared/geometry';
import { DEMO_ROOM_NOTE, STAGE3_ROOM } from './demo-stage3-room';

/*
 * DEMO DATA — invented. The demo developer's measurement microphone (serial and calibration made up) and
 * Stage 3 measured by sweeps: every channel's sweep "recorded" at the listening position with a loopback,
 * synthesised here from the room's geometry (time of flight at 21 °C, 1/r level, one floor reflection and
 * an invented interface latency), then stored through the same upload path a real recording takes. None of
 * it was measured; it exists so the capture workflow can be explored on the demo.
 */

const DEMO_OWNER_EMAIL = 'dev@kestrel.example';
const NOTE = 'Demo data: a synthetic sweep recording, invented, not a measurement of anything.';

/** The demo microphone's calibration file, invented: a gentle low-end roll-off and a top-end lift. */
export const DEMO_MICROPHONE_CALIBRATION = `"Demo data: invented calibration, serial KY-0417 (not a real microphone)"
* Frequency (Hz)\tDeviation (dB)\tPhase (deg)
10\t-3.1\t38.0
20\t-1.2\t14.5
31.5\t-0.6\t7.9
50\t-0.3\t4.2
100\t-0.1\t1.6
250\t0.0\t0.5
1000\t0.0\t0.0
4000\t0.3\t-2.6
8000\t0.9\t-6.8
12500\t1.6\t-11.9
16000\t2.2\t-16.4
20000\t2.9\t-22.0
`;

export const DEMO_MICROPHONE = {
  name: 'Sweep rig microphone (demo)',
  serial: 'KY-0417',
  notes: 'Demo data: invented microphone, calibration and sensitivity.',
  calibrationFileName: 'ky-0417-invented.txt',
  // Reads −32.5 dBFS (raw RMS) at 94 dB SPL through the demo interface at its demo gain: SPL = dBFS + 126.5.
  sensitivity: { dbfsAt94DbSpl: -32.5 },
};

const FS = 48000;
/** The demo sweep: 1 s, 20 Hz–20 kHz, −12 dBFS, the test-signal fades (short, to keep start-up quick). */
export const DEMO_SWEEP: SweepSpec = {
  sampleRateHz: FS,
  startHz: 20,
  endHz: 20000,
  durationS: 1,
  fadeInS: 0.05,
  fadeOutS: 0.01,
  levelDbfs: -12,
  silenceAfterS: 0,
};
/** Speed of sound at 21 °C, m/s (343.2·sqrt((21 + 273.15)/293.15)). */
const SPEED_OF_SOUND_MPS = 343.8;
/** Invented interface latency between the output and the inputs, samples (5 ms). */
const LATENCY_SAMPLES = 240;
/** Recording after the sweep's start: the sweep plus 0.6 s for the room's decay. */
const RECORDING_S = 1.6;

/** Time of flight from each loudspeaker to the listening position, samples (fractional). */
export function demoFlightSamples(channel: string): number {
  const s = STAGE3_ROOM.loudspeakers.find((l) => l.id === channel);
  if (!s) throw new Error(`demo seed: no loudspeaker ${channel}`);
  const l = STAGE3_ROOM.listener;
  return (Math.hypot(s.x - l.x, s.y - l.y, s.z - l.z) / SPEED_OF_SOUND_MPS) * FS;
}

/**
 * The two-channel "recording" of one loudspeaker's sweep: input 1 the microphone (direct sound at 1/r re
 * 1 m, a floor reflection over the image path at 0.5 of its 1/r, a faint noise floor), input 2 the loopback.
 */
function syntheticRecording(channel: string, sweep: Float64Array, seed: number): Buffer {
  const s = STAGE3_ROOM.loudspeakers.find((l) => l.id === channel);
  if (!s) throw new Error(`demo seed: no loudspeaker ${channel}`);
  const l = STAGE3_ROOM.listener;
  const direct = Math.hypot(s.x - l.x, s.y - l.y, s.z - l.z);
  const viaFloor = Math.hypot(s.x - l.x, s.y - l.y, s.z + l.z);
  const length = Math.round(RECORDING_S * FS);
  const mic = new Float64Array(length);
  const loop = new Float64Array(length);
  const noise = seededGaussian(seed);
  const add = (out: Float64Array, atSamples: number, gain: number) => {
    // A fractional delay by linear interpolation between neighbouring samples (enough for demo data).
    const whole = Math.floor(atSamples);
    const frac = atSamples - whole;
    for (let i = 0; i < sweep.length; i++) {
      const j = whole + i;
      if (j + 1 < out.length) {
        out[j] += gain * (1 - frac) * sweep[i];
        out[j + 1] += gain * frac * sweep[i];
      }
    }
  };
  add(mic, LATENCY_SAMPLES + (direct / SPEED_OF_SOUND_MPS) * FS, 0.5 / direct);
  add(mic, LATENCY_SAMPLES + (viaFloor / SPEED_OF_SOUND_MPS) * FS, 0.25 / viaFloor);
  for (let i = 0; i < length; i++) mic[i] += 1e-4 * noise();
  add(loop, LATENCY_SAMPLES, 1);
  const wav = new WaveFile();
  const pcm = [mic, loop].map((c) => Array.from(c, (v) => Math.round(v * 8388607)));
  wav.fromScratch(2, FS, '24', pcm);
  return Buffer.from(wav.toBuffer());
}

/** Stores the demo microphone and Stage 3's layout measured by sweeps; runs after the demo users. */
export async function seedDemoStage3Sweeps(services: Services): Promise<void> {
  const { User, Room, Measurement, Microphone } = services.db.models;
  const owner = await User.findOne({ where: { email: DEMO_OWNER_EMAIL } });
  if (!owner) throw new Error(`demo seed: ${DEMO_OWNER_EMAIL} is missing; load the demo users first`);
  const layout = checkRoomDefinition(STAGE3_ROOM);
  const { room, mic } = await services.db.write(async (transaction) => {
    const mic = await Microphone.create(
      {
        id: newId('mic'),
        ownerId: owner.id,
        name: DEMO_MICROPHONE.name,
        serial: DEMO_MICROPHONE.serial,
        notes: DEMO_MICROPHONE.notes,
        calibration: {
          ...parseCalibrationText(DEMO_MICROPHONE_CALIBRATION, '/calibrationText'),
          fileName: DEMO_MICROPHONE.calibrationFileName,
        },
        sensitivity: DEMO_MICROPHONE.sensitivity,
        splOffset: { offsetDb: 94 - DEMO_MICROPHONE.sensitivity.dbfsAt94DbSpl, source: 'sensitivity' },
      },
      { transaction },
    );
    const room = await Room.create(
      {
        id: newId('room'),
        ownerId: owner.id,
        // Named without "Stage 3" so the demo's own room keeps a name no other room shares.
        name: 'Mix room measured by sweeps (demo)',
        layoutId: layout.id,
        dimensions: STAGE3_ROOM.dimensions,
        listener: STAGE3_ROOM.listener,
        loudspeakers: STAGE3_ROOM.loudspeakers,
        limits: STAGE3_ROOM.limits,
        sampleRateHz: STAGE3_ROOM.sampleRateHz,
        profileId: null,
        notes: `${DEMO_ROOM_NOTE} Stage 3's layout, every channel measured by a synthetic sweep with the demo microphone and a loopback.`,
      },
      { transaction },
    );
    await recordRoomState(services.db.models, room, transaction);
    return { room, mic };
  });

  const sweep = exponentialSweep(DEMO_SWEEP);
  const entries: Array<{ channel: string; content: MeasurementContent }> = [];
  for (const [index, { id: channel }] of STAGE3_ROOM.loudspeakers.entries()) {
    const file = syntheticRecording(channel, sweep, 100 + index);
    // Start-up work: analysed on this thread rather than by starting a worker thread for a few files.
    const content = await contentFromFile(
      onThisThread,
      { buffer: file, originalname: `demo-sweep-${channel}.wav`, mimetype: 'audio/wav', size: file.length },
      {
        channel,
        micPosition: 'MLP',
        fileKind: 'sweepRecording',
        fileChannel: 0,
        referenceFileChannel: 1,
        durationS: DEMO_SWEEP.durationS,
        levelDbfs: DEMO_SWEEP.levelDbfs,
        smoothingOctaves: 1 / 6,
        temperatureC: 21,
      },
      room,
    );
    entries.push({ channel, content: correctedBy(content, mic) });
  }
  await services.db.write(async (transaction) => {
    for (const entry of entries) {
      await Measurement.create(
        {
          id: newId('meas'),
          roomId: room.id,
          ownerId: room.ownerId,
          channel: entry.channel,
          micPosition: 'MLP',
          name: `Demo data — sweep ${entry.channel}`,
          notes: NOTE,
          ...entry.content,
          createdByKeyId: null,
        },
        { transaction },
      );
    }
  });
}
