/**
 * Default of the most JavaScript heap (V8's old generation, MiB) one worker thread may hold
 * (`HEAVY_WORK_HEAP_MB` overrides it). Without a limit a task whose input is inside the contract but
 * whose working set is not (a stored room with very many long measurements) grows until the whole
 * process dies, taking every request with it; with one, only that thread ends, the pool starts another
 * and the request is answered 422 (`calculation-too-large`).
 * Sized from the heaviest requests the contract takes, run on a worker at several limits: a 30 s
 * 192 kHz impulse response with the largest waterfall and spectrogram fails at 64 MiB and passes at
 * 128 MiB (at twice its usual time, the collector working hard), a 28 s 192 kHz sweep and the costliest
 * plan pass at 128 MiB. 512 is four times that, so no request the contract allows comes near it, and
 * with one thread per core beside the event loop it stays well inside a small server's memory.
 * Typed arrays (samples, spectra) live outside this heap and are not counted.
 */
export const WORKER_HEAP_LIMIT_MB = 512;

/**
 * Least heap a worker thread may be given: measured here, a thread running from TypeScript source
 * (tsx compiling the calculations as it loads them) cannot start in 32 MiB and starts in 48.
 */
export const WORKER_HEAP_MIN_MB = 48;
