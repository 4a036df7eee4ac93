import { SignalProblemError } from '../../shared/analysis/signal-problem';
import { CalculationInputError } from '../../shared/errors';
import { ProblemError } from '../http/problem';
import { HeavyWork } from './heavy-work';

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
