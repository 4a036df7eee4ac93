import { WaveFile } from 'wavefile';
import { newId } from '../api/db/ids';
import {
  contentFromFile,
  contentFromJson,
  type MeasurementContent,
} from '../api/measurements/measurement-input';
import type { Services } from '../api/services';
import { onThisThread } from '../api/work/heavy-work';
import { noisyDecay } from '../shared/analysis/test-signals';
import { stage3MeasuredResponses, stage3MeasuredResponsesWithPhase } from './demo-stage3-measurements';
import { STAGE3_ROOM, STAGE3_SPL_DB } from './demo-stage3-room';

/*
 * DEMO DATA — invented measurements of Stage 3 (Kestrel Yard Post is fictional), stored the way an upload
 * would store them (the same input functions the measurements route uses): SPL readings of every channel,
 * the invented responses the demo tunings were planned from at the listening position, a second
 * microphone position for two channels, and one synthetic impulse response of the left side surround
 * (a channel without a stored response, so the spatial average never mixes its dBFS scale with SPL).
 * None of it was measured.
 */

const NOTE = 'Demo data: invented, not a measurement of anything.';
/** Level at which the invented responses are stored, so they read like SPL at the listening position. */
const RESPONSE_LEVEL_DB = 82;
const IR_SAMPLE_RATE_HZ = 48000;

/**
 * The response seen 0.5 m to the left of the listening position: the same loudspeaker, with the low-end
 * ripple moved (invented: a smooth ±2.5 dB ripple below 300 Hz on top of the first position's response).
 */
function secondPosition(frequenciesHz: number[], magnitudeDb: number[]): number[] {
  return magnitudeDb.map((db, i) => {
    const f = frequenciesHz[i];
    const fade = f < 300 ? 1 : Math.max(0, 1 - Math.log2(f / 300));
    return Math.round((db + 2.5 * fade * Math.sin(3 * Math.log2(f / 25))) * 100) / 100;
  });
}

/** The left side surround (M+090) is 2.80 m from the listening position; sound at 21 °C, m/s. */
const IR_DISTANCE_M = 2.8;
const IR_SPEED_OF_SOUND_MPS = 343.8;

/**
 * A synthetic impulse response: a direct-sound spike after the time of flight (8.14 ms) and a noise tail
 * decaying with an invented T60 of 0.30 s, 1 s at 48 kHz, as a 32-bit float WAV.
 */
function syntheticSurroundIr(): Buffer {
  const arrival = Math.round((IR_DISTANCE_M / IR_SPEED_OF_SOUND_MPS) * IR_SAMPLE_RATE_HZ);
  const samples = noisyDecay({
    sampleRateHz: IR_SAMPLE_RATE_HZ,
    durationS: 1,
    t60S: 0.3,
    startSample: arrival,
    startRms: 0.05,
    noiseDb: -75,
    seed: 3,
  });
  samples[arrival] += 0.7;
  const wav = new WaveFile();
  wav.fromScratch(1, IR_SAMPLE_RATE_HZ, '32f', Array.from(samples));
  return Buffer.from(wav.toBuffer());
}

/** Stores the invented Stage 3 measurements; runs after the Stage 3 room seed. */
export async function seedDemoStage3Measurements(services: Services): Promise<void> {
  const { Room, Measurement } = services.db.models;
  const room = await Room.findOne({ where: { name: 'Stage 3' } });
  if (!room) throw new Error('demo seed: room "Stage 3" is missing; load the Stage 3 room first');

  const entries: Array<{ channel: string; micPosition: string; name: string; content: MeasurementContent }> =
    [];
  for (const [channel, splDb] of Object.entries(STAGE3_SPL_DB)) {
    entries.push({
      channel,
      micPosition: 'MLP',
      name: `Demo data — SPL ${channel}`,
      content: contentFromJson({ kind: 'spl', splDb, weighting: 'C', timeWeighting: 'slow' }),
    });
  }
  const l = STAGE3_ROOM.listener;
  const withPhase = stage3MeasuredResponsesWithPhase(
    Object.fromEntries(
      STAGE3_ROOM.loudspeakers.map((s) => [s.id, Math.hypot(s.x - l.x, s.y - l.y, s.z - l.z)]),
    ),
  );
  for (const [channel, response] of Object.entries(stage3MeasuredResponses())) {
    const atLevel = response.magnitudeDb.map((db) => Math.round((db + RESPONSE_LEVEL_DB) * 100) / 100);
    // At the listening position the responses carry phase (captured against a loopback), so the
    // subwoofer can be integrated from them.
    entries.push({
      channel,
      micPosition: 'MLP',
      name: `Demo data — response ${channel}`,
      content: contentFromJson({
        kind: 'frequencyResponse',
        response: {
          frequenciesHz: response.frequenciesHz,
          magnitudeDb: atLevel,
          phaseDeg: withPhase[channel].phaseDeg,
        },
      }),
    });
    if (channel === 'M+030' || channel === 'M+000') {
      entries.push({
        channel,
        micPosition: '2',
        name: `Demo data — response ${channel}, 0.5 m left`,
        content: contentFromJson({
          kind: 'frequencyResponse',
          response: {
            frequenciesHz: response.frequenciesHz,
            magnitudeDb: secondPosition(response.frequenciesHz, atLevel),
          },
        }),
      });
    }
  }
  const ir = syntheticSurroundIr();
  entries.push({
    channel: 'M+090',
    micPosition: 'MLP',
    name: 'Demo data — synthetic impulse response M+090',
    // Start-up work: analysed on this thread rather than by starting a worker thread for one file.
    content: await contentFromFile(
      onThisThread,
      { buffer: ir, originalname: 'demo-side-surround-ir.wav', mimetype: 'audio/wav', size: ir.length },
      { channel: 'M+090', micPosition: 'MLP', temperatureC: 21, smoothingOctaves: 1 / 6 },
      room,
    ),
  });

  await services.db.write(async (transaction) => {
    for (const entry of entries) {
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
          createdByKeyId: null,
        },
        { transaction },
      );
    }
  });
}
