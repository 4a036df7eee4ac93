import { HttpClient, HttpErrorResponse, HttpHeaders } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, throwError } from 'rxjs';
import type { components, operations } from '../../../../shared/contract/api-types';
import {
  impulseResponseOf,
  type ImpulseResponseAnalysis,
  type Measurement,
} from '../rooms/room-measurements/measurement.model';

type Schemas = components['schemas'];

export type TestSignalDescription = Schemas['TestSignal'];

/**
 * The sweep played: what `POST /v1/test-signals` makes and what the deconvolution needs to know (the page
 * always gives every one of these, at the browser's own rate).
 */
export type SweepSettings = Required<
  Pick<
    Schemas['TestSignalRequest'],
    'sampleRateHz' | 'startHz' | 'endHz' | 'durationS' | 'fadeInS' | 'fadeOutS' | 'levelDbfs'
  >
>;

/** `POST /v1/analysis/sweep`'s answer: the take's analysis, with the file's details. */
export type SweepAnalysis =
  operations['analyzeSweepRecording']['responses'][200]['content']['application/json'];

/** A recorded take analysed: stored as a measurement, or (on a server without stored sweeps) only analysed. */
export interface TakeResult {
  stored: Measurement | null;
  analysis: ImpulseResponseAnalysis;
}

function sweepRequest(sweep: SweepSettings): Schemas['TestSignalRequest'] {
  // A single float sweep without trailing silence: the recording's length is the page's own choice.
  return { kind: 'sweep', encoding: 'float32', silenceAfterS: 0, ...sweep };
}

function sweepFields(form: FormData, sweep: SweepSettings): void {
  for (const key of ['startHz', 'endHz', 'durationS', 'fadeInS', 'fadeOutS', 'levelDbfs'] as const)
    form.append(key, String(sweep[key]));
}

@Injectable({ providedIn: 'root' })
export class CaptureService {
  private readonly http = inject(HttpClient);

  /** The sweep's description with its cautions (real levels), for the confirmation before playing. */
  describe(sweep: SweepSettings): Observable<TestSignalDescription> {
    return this.http.post<TestSignalDescription>('/v1/test-signals', sweepRequest(sweep), {
      headers: new HttpHeaders({ Accept: 'application/json' }),
    });
  }

  /** The sweep itself, as a float WAV at the browser's rate. */
  sweepWav(sweep: SweepSettings): Observable<ArrayBuffer> {
    return this.http.post('/v1/test-signals', sweepRequest(sweep), {
      headers: new HttpHeaders({ Accept: 'audio/wav' }),
      responseType: 'arraybuffer',
    });
  }

  /**
   * Stores a recorded sweep as a measurement of `channel` (deconvolved and analysed on arrival). A server
   * that does not store recorded sweeps yet refuses `fileKind`; the take is then analysed with
   * `POST /v1/analysis/sweep` and shown, not stored, and the result says so.
   */
  storeTake(
    roomId: string,
    channel: string,
    micPosition: string,
    wav: Blob,
    sweep: SweepSettings,
    referenceChannel: number | null,
    decayFields: Array<[string, string]> = [],
  ): Observable<TakeResult> {
    const form = new FormData();
    form.append('channel', channel);
    form.append('micPosition', micPosition);
    form.append('fileKind', 'sweepRecording');
    form.append('fileChannel', '0');
    if (referenceChannel !== null) form.append('referenceFileChannel', String(referenceChannel));
    sweepFields(form, sweep);
    for (const [field, value] of decayFields) form.append(field, value);
    form.append('name', `${channel} swept from the browser`);
    form.append('file', wav, `${channel}-sweep.wav`);
    return this.http.post<Measurement>(`/v1/rooms/${encodeURIComponent(roomId)}/measurements`, form).pipe(
      map((stored) => {
        const analysis = impulseResponseOf(stored);
        if (!analysis) throw new Error('The stored take came back without its impulse-response analysis.');
        return { stored, analysis };
      }),
      catchError((error: unknown) =>
        refusesSweepUploads(error)
          ? this.analyse(wav, sweep, referenceChannel, decayFields).pipe(
              map((analysis) => ({ stored: null, analysis })),
            )
          : throwError(() => error),
      ),
    );
  }

  /** `POST /v1/analysis/sweep`: the take analysed without storing it. */
  analyse(
    wav: Blob,
    sweep: SweepSettings,
    referenceChannel: number | null,
    decayFields: Array<[string, string]> = [],
  ): Observable<SweepAnalysis> {
    const form = new FormData();
    form.append('channel', '0');
    if (referenceChannel !== null) form.append('referenceChannel', String(referenceChannel));
    sweepFields(form, sweep);
    for (const [field, value] of decayFields) form.append(field, value);
    form.append('file', wav, 'take.wav');
    return this.http.post<SweepAnalysis>('/v1/analysis/sweep', form);
  }
}

/** A 400 naming `fileKind` (or a sweep field) as unknown: the server predates stored sweep recordings. */
function refusesSweepUploads(error: unknown): boolean {
  if (!(error instanceof HttpErrorResponse) || error.status !== 400) return false;
  return JSON.stringify(error.error ?? '').includes('fileKind');
}
