import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, map, reduce } from 'rxjs';
import { ListPage } from '../../keys/key.model';
import {
  AverageResponse,
  EqFitRequest,
  EqFitResult,
  Measurement,
  ResponseKind,
  StoredTargetCurve,
  UploadOptions,
} from './measurement.model';

/** Stored measurements of a room and the EQ fit of a measured response. */
@Injectable({ providedIn: 'root' })
export class MeasurementsService {
  private readonly http = inject(HttpClient);

  private base(roomId: string): string {
    return `/v1/rooms/${encodeURIComponent(roomId)}/measurements`;
  }

  /**
   * Every measurement of the room taken without a tuning loaded (what plans use), oldest first, following
   * the cursor to the end. Those taken with a tuning loaded belong to that tuning's verification.
   */
  list(roomId: string): Observable<Measurement[]> {
    const page = (startingAfter?: string) => {
      let params = new HttpParams().set('limit', 100).set('stage', 'before');
      if (startingAfter) params = params.set('startingAfter', startingAfter);
      return this.http.get<ListPage<Measurement>>(this.base(roomId), { params });
    };
    return page().pipe(
      expand((p) => {
        const last = p.data.at(-1);
        return p.hasMore && last ? page(last.id) : EMPTY;
      }),
      reduce((all, p) => all.concat(p.data), [] as Measurement[]),
    );
  }

  get(roomId: string, id: string): Observable<Measurement> {
    return this.http.get<Measurement>(`${this.base(roomId)}/${encodeURIComponent(id)}`);
  }

  /**
   * Multipart upload: the API analyses a WAV on arrival or parses a text response. `options` carry the
   * WAV-only fields: the 0-based channel of a multichannel file, its loopback (timing reference) channel
   * and the smoothing of the stored response.
   */
  upload(
    roomId: string,
    channel: string,
    micPosition: string,
    file: Blob & { name?: string },
    options: UploadOptions = {},
  ): Observable<Measurement> {
    const form = new FormData();
    form.append('channel', channel);
    form.append('micPosition', micPosition);
    if (options.fileChannel !== undefined) form.append('fileChannel', String(options.fileChannel));
    if (options.referenceFileChannel !== undefined)
      form.append('referenceFileChannel', String(options.referenceFileChannel));
    if (options.smoothingOctaves !== undefined)
      form.append('smoothingOctaves', String(options.smoothingOctaves));
    for (const [field, value] of options.decayFields ?? []) form.append(field, value);
    if (options.name) form.append('name', options.name);
    if (options.notes) form.append('notes', options.notes);
    form.append('file', file, file.name ?? 'recording.wav');
    return this.http.post<Measurement>(this.base(roomId), form);
  }

  delete(roomId: string, id: string): Observable<null> {
    return this.http.delete<null>(`${this.base(roomId)}/${encodeURIComponent(id)}`);
  }

  /**
   * Power average of the channel's responses over its microphone positions; `kind` says which responses
   * when the channel has both impulse-response analyses and frequency responses (the API never mixes them).
   */
  average(roomId: string, channel: string, kind?: ResponseKind): Observable<AverageResponse> {
    let params = new HttpParams().set('channel', channel);
    if (kind) params = params.set('kind', kind);
    return this.http.get<AverageResponse>(`${this.base(roomId)}/average`, { params });
  }

  /** The caller's stored target curves (first 100, oldest first), for the fit's target choice. */
  targetCurves(): Observable<StoredTargetCurve[]> {
    return this.http
      .get<ListPage<StoredTargetCurve>>('/v1/target-curves', { params: new HttpParams().set('limit', 100) })
      .pipe(map((page) => page.data));
  }

  fitEq(body: EqFitRequest): Observable<EqFitResult> {
    return this.http.post<EqFitResult>('/v1/eq/fit', body);
  }
}
