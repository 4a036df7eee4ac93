import { readdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { stage3MeasuredResponses } from '../../seeds/demo-stage3-measurements';
import { SignalProblemError } from '../../shared/analysis/signal-problem';
import { exponentialSweep, type SweepSpec } from '../../shared/capture/sweep';
import { playedSweep, type SweepWavInput } from '../../shared/capture/sweep-wav';
import { CalculationInputError } from '../../shared/errors';
import { planStoredRoom, type StoredMeasurement } from '../../shared/plan';
import { ProblemError } from '../http/problem';
import { HeavyWork } from './heavy-work';
import { tasks, type StoredPlanInput } from './tasks';

// A fit the core accepts, and the same with frequencies out of order (the core refuses that).
const measured = { frequenciesHz: [20, 100, 1000, 10000], magnitudeDb: [0, 6, 0, 0] };
const fit = { sampleRateHz: 48000, maxBands: 2, measured };
const unordered = { ...fit, measured: { ...measured, frequenciesHz: [20, 1000, 100, 10000] } };

describe('HeavyWork', () => {
  const work = new HeavyWork({ threads: 1, queueLimit: 1 });
  afterAll(() => work.close());

  it('runs a task on a worker thread and answers what the core computed', async () => {
    const result = await work.run('fitEq', fit);
    expect(result.bands.length).toBeGreaterThan(0);
    expect(result.predicted.frequenciesHz).toEqual(measured.frequenciesHz);
    expect(work.inFlight).toBe(0);
  });

  it('gives back the core refusal as the same error class, naming the same field', async () => {
    const refusal = await work.run('fitEq', unordered).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(CalculationInputError);
    expect(refusal).not.toBeInstanceOf(SignalProblemError);
    expect((refusal as CalculationInputError).field).toBe('/measured/frequenciesHz/2');
    expect((refusal as Error).message).toMatch(/ascend/);
  });

  it('gives back a refused signal with its reason', async () => {
    const bytes = Buffer.from('this is not a RIFF file, just some text that is long enough to be read');
    const refusal = await work
      .run('analyseWav', { bytes, smoothingOctaves: 1 / 12, temperatureC: 20 })
      .catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(SignalProblemError);
    expect((refusal as SignalProblemError).code).toBe('notWav');
    expect((refusal as SignalProblemError).field).toBe('/file');
  });

  it('takes threads + queueLimit tasks at once and refuses the next with a 503 and Retry-After', async () => {
    // Admission is counted synchronously when run() is called, so this does not depend on timing.
    const admitted = [work.run('fitEq', fit), work.run('fitEq', fit)];
    expect(work.inFlight).toBe(work.capacity);
    const refused = await work.run('fitEq', fit).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(ProblemError);
    const problem = refused as ProblemError;
    expect(problem.status).toBe(503);
    expect(Number(problem.headers['Retry-After'])).toBeGreaterThanOrEqual(1);
    await Promise.all(admitted);
    // Once they are done there is room again.
    expect(work.inFlight).toBe(0);
    await expect(work.run('fitEq', fit)).resolves.toHaveProperty('bands');
  });

  it('drops a task whose client went away', async () => {
    const controller = new AbortController();
    const running = work.run('fitEq', fit, controller.signal).catch((e: unknown) => e);
    controller.abort();
    const outcome = await running;
    expect(outcome).toBeInstanceOf(ProblemError);
    expect((outcome as ProblemError).status).toBe(503);
    expect(work.inFlight).toBe(0);
  });

  it('refuses work once closed', async () => {
    const closed = new HeavyWork({ threads: 1, queueLimit: 0 });
    await closed.close();
    await expect(closed.run('fitEq', fit)).rejects.toMatchObject({ status: 503 });
  });
});

/** A 24-bit mono WAV of the samples (full scale ±1), encoded with wavefile. */
function wav24(samples: Float64Array, sampleRateHz: number): Buffer {
  const file = new WaveFile();
  file.fromScratch(
    1,
    sampleRateHz,
    '24',
    Array.from(samples, (v) => Math.round(v * 8388607)),
  );
  return Buffer.from(file.toBuffer());
}

/** A 1 s sweep as a room returns it: 2 ms late, half level, with 0.3 s of room after it. */
const sweep: SweepSpec = {
  sampleRateHz: 48000,
  startHz: 20,
  endHz: 20000,
  durationS: 1,
  fadeInS: 0.05,
  fadeOutS: 0.01,
  levelDbfs: -12,
  silenceAfterS: 0,
};
function sweepRecording(): Buffer {
  const played = exponentialSweep(sweep);
  const recorded = new Float64Array(played.length + 0.3 * 48000);
  recorded.set(
    played.map((v) => v / 2),
    96,
  );
  return wav24(recorded, 48000);
}
const sweepForm = (bytes: Uint8Array): SweepWavInput => ({
  bytes,
  sweep: playedSweep(sweep),
  offsetS: 0,
  method: 'regularizedDivision',
  smoothingOctaves: 1 / 12,
  temperatureC: 20,
  room: STAGE3_ROOM.dimensions,
});

/** Stage 3 (demo) as stored: SPL readings of every channel and the left channel's response at two positions. */
function storedStage3(): StoredPlanInput {
  const left = stage3MeasuredResponses()['M+030'];
  const measurements: StoredMeasurement[] = [
    ...Object.entries(STAGE3_SPL_DB).map(([channel, splDb], i) => ({
      id: `mea_${String(i).padStart(3, '0')}`,
      channel,
      micPosition: 'MLP',
      kind: 'spl' as const,
      stage: null,
      result: { splDb, weighting: 'C', timeWeighting: 'slow' },
    })),
    ...['MLP', '2'].map((micPosition, k) => ({
      id: `mea_1${k}`,
      channel: 'M+030',
      micPosition,
      kind: 'frequencyResponse' as const,
      stage: null,
      result: { frequenciesHz: left.frequenciesHz, magnitudeDb: left.magnitudeDb.map((x) => x + 80 + 6 * k) },
    })),
  ];
  return {
    room: {
      layoutId: STAGE3_ROOM.layout,
      dimensions: STAGE3_ROOM.dimensions,
      listener: STAGE3_ROOM.listener,
      loudspeakers: STAGE3_ROOM.loudspeakers,
      limits: STAGE3_ROOM.limits,
      sampleRateHz: STAGE3_ROOM.sampleRateHz,
      profile: null,
    },
    measurements,
    overrides: { targets: { referenceDb: 79, crossoverHz: 80 }, temperatureC: 21 },
  };
}

describe('HeavyWork tasks answer what the direct calculation answers', () => {
  const work = new HeavyWork({ threads: 1, queueLimit: 4 });
  afterAll(() => work.close());

  it('analyses a recorded sweep on the worker exactly as on this thread', async () => {
    const bytes = sweepRecording();
    const direct = tasks.analyseSweepWav(sweepForm(bytes));
    const pooled = await work.run('analyseSweepWav', sweepForm(bytes));
    expect(pooled).toEqual(direct);
    // The recording is half level: the linear response sits near −6 dB, and the file is read as sent.
    expect(pooled.file).toEqual({
      sampleRateHz: 48000,
      channelCount: 1,
      channelIndex: 0,
      encoding: 'pcm24',
      durationS: (48000 + 0.3 * 48000) / 48000,
    });
  });

  it('plans a stored room on the worker exactly as on this thread', async () => {
    const input = storedStage3();
    const direct = planStoredRoom(input.room, input.measurements, input.overrides);
    const pooled = await work.run('planStoredRoom', storedStage3());
    expect(pooled).toEqual(direct);
    expect(pooled.measurements.used).toContain('mea_10');
  });

  it('gives back the refusal of a sweep cut outside the file, naming the field', async () => {
    const input = sweepForm(sweepRecording());
    const refusal = await work.run('analyseSweepWav', { ...input, offsetS: 5 }).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(CalculationInputError);
    expect((refusal as CalculationInputError).field).toBe('/offsetS');
  });

  it('moves a large upload to the worker instead of copying it, and copies a small pooled one', async () => {
    const large = sweepRecording();
    expect(large.byteLength).toBeGreaterThan(Buffer.poolSize);
    const direct = tasks.analyseSweepWav(sweepForm(Buffer.from(large)));
    const moved = await work.run('analyseSweepWav', sweepForm(large), undefined, [large]);
    expect(moved).toEqual(direct);
    // Moved: this thread's view of the memory is gone.
    expect(large.byteLength).toBe(0);

    const small = Buffer.from('RIFF\u0004\u0000\u0000\u0000WAVE');
    expect(small.buffer.byteLength).toBe(Buffer.poolSize);
    const refusal = await work
      .run('analyseWav', { bytes: small, smoothingOctaves: 1 / 12, temperatureC: 20 }, undefined, [small])
      .catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(SignalProblemError);
    // Copied: the pool it was cut from (and this Buffer) are untouched.
    expect(small.toString('latin1', 8, 12)).toBe('WAVE');
  });

  it('makes a test signal on the worker, its WAV file moved back byte for byte', async () => {
    const request = { kind: 'sweep' as const, sampleRateHz: 48000, encoding: 'pcm24' as const, durationS: 2 };
    const direct = tasks.testSignal({ request, wav: true });
    const pooled = await work.run('testSignal', { request, wav: true });
    expect(pooled.signal).toEqual(direct.signal);
    expect(Buffer.from(pooled.wav as Uint8Array).equals(Buffer.from(direct.wav as Uint8Array))).toBe(true);
    // As long as the description says: 24-bit mono at 48 kHz after a 44-byte header.
    expect(pooled.wav?.byteLength).toBe(pooled.signal.sizeBytes);
    expect((pooled.signal.sizeBytes - 44) % 3).toBe(0);
    const described = await work.run('testSignal', { request, wav: false });
    expect(described).toEqual({ signal: direct.signal, wav: null });
  });

  it('detects the timing reference in the loopback channel on the worker', async () => {
    // Two channels: the loudspeaker's impulse at 10 ms, the loopback's at 2 ms.
    const file = new WaveFile();
    const mic = new Array<number>(48000).fill(0);
    const loop = new Array<number>(48000).fill(0);
    mic[480] = 8388607 >> 1;
    loop[96] = 8388607 >> 1;
    file.fromScratch(2, 48000, '24', [mic, loop]);
    const bytes = Buffer.from(file.toBuffer());
    const input = { bytes, channel: 0, referenceChannel: 1, smoothingOctaves: 1 / 12, temperatureC: 20 };
    const pooled = await work.run('analyseWav', input);
    expect(pooled).toEqual(tasks.analyseWav(input));
    expect(pooled.timingReferenceMs).toBeCloseTo(2, 1);
    expect(pooled.analysis.arrival.arrivalMs - (pooled.timingReferenceMs as number)).toBeCloseTo(8, 1);
  });
});

/** Nice values of this process's threads (Linux: field 19 of /proc/<pid>/task/<tid>/stat). */
function threadNiceValues(): Map<number, number> {
  const values = new Map<number, number>();
  for (const tid of readdirSync(`/proc/${process.pid}/task`)) {
    const stat = readFileSync(`/proc/${process.pid}/task/${tid}/stat`, 'latin1');
    // Fields after the command name (which may hold spaces) start at field 3; nice is field 19.
    values.set(Number(tid), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[16]));
  }
  return values;
}

describe('HeavyWork threads on Linux', () => {
  const work = new HeavyWork({ threads: 2, queueLimit: 0, nice: 7 });
  afterAll(() => work.close());

  it('lowers the priority of each worker thread alone, by the nice steps given', async () => {
    expect(process.platform).toBe('linux');
    const before = threadNiceValues();
    await Promise.all([work.run('fitEq', fit), work.run('fitEq', fit)]);
    const after = threadNiceValues();
    const base = os.getPriority(0);
    // The event loop's thread (its id is the process id) keeps the process's priority.
    expect(after.get(process.pid)).toBe(base);
    const added = [...after].filter(([tid]) => !before.has(tid));
    expect(added.filter(([, nice]) => nice === base + 7)).toHaveLength(2);
  });
});

describe('HeavyWork memory limit', () => {
  // Enough heap for a thread to load the calculations and plan a room, far too little for the room below.
  const work = new HeavyWork({ threads: 2, queueLimit: 2, heapLimitMb: 64 });
  afterAll(() => work.close());

  /** Stage 3 with 60 more stored responses of 100 000 points each: about 96 MB of numbers once cloned. */
  function oversizedRoom(): StoredPlanInput {
    const input = storedStage3();
    const frequenciesHz = Array.from({ length: 100_000 }, (_, i) => 20 + i * 0.2);
    for (let k = 0; k < 60; k++) {
      input.measurements.push({
        id: `mea_2${String(k).padStart(2, '0')}`,
        channel: 'M+030',
        micPosition: `P${k}`,
        kind: 'frequencyResponse',
        stage: null,
        // A copy each, so the clone cannot share one array between them.
        result: { frequenciesHz: frequenciesHz.slice(), magnitudeDb: frequenciesHz.map((f) => 80 + k / f) },
      });
    }
    return input;
  }

  it('answers a task that outgrows its heap with a 422 naming what to make smaller, and keeps serving', async () => {
    expect(work.heapLimitMb).toBe(64);
    // A fit on the other thread, running while the oversized plan exhausts its own.
    const beside = work.run('fitEq', fit);
    const refused = await work.run('planStoredRoom', oversizedRoom()).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(ProblemError);
    const problem = refused as ProblemError;
    expect(problem.status).toBe(422);
    expect(problem.type).toBe('calculation-too-large');
    expect(problem.detail).toMatch(/stored measurements are too many or too long/);
    expect(problem.detail).toMatch(/more than 64 MiB/);
    expect(problem.extensions).toEqual({ heapLimitMb: 64 });
    await expect(beside).resolves.toHaveProperty('bands');
    expect(work.inFlight).toBe(0);
    // The dead thread was replaced: both threads take a task at once again, and a normal plan still fits.
    const again = await Promise.all([work.run('fitEq', fit), work.run('planStoredRoom', storedStage3())]);
    expect(again[0].bands.length).toBeGreaterThan(0);
    expect(again[1].measurements.used).toContain('mea_10');
  });
});
