import type { TuningExport } from './export-summary';
import type { operations } from '../../../../shared/contract/api-types';
import { HttpClient, HttpHeaders, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, map, reduce } from 'rxjs';
import { ListPage } from '../keys/key.model';
import {
  Tuning,
  TuningComparison,
  TuningCreate,
  TuningSide,
  TuningUpdate,
  TuningVersion,
} from './tuning.model';

const path = (tuningId: string) => `/v1/tunings/${encodeURIComponent(tuningId)}`;

/** The tuning operations of the API, one method each. */
@Injectable({ providedIn: 'root' })
export class TuningsService {
  private readonly http = inject(HttpClient);

  /** A new tuning (version 1) from settings per channel. */
  create(roomId: string, body: TuningCreate): Observable<Tuning> {
    return this.http.post<Tuning>(`/v1/rooms/${encodeURIComponent(roomId)}/tunings`, body);
  }

  /** The latest version, or `version`. */
  tuning(tuningId: string, version?: number): Observable<Tuning> {
    const params = version ? new HttpParams().set('version', version) : undefined;
    return this.http.get<Tuning>(path(tuningId), { params });
  }

  /** Every version, oldest first (the pager's cursor is a version number). */
  versions(tuningId: string): Observable<TuningVersion[]> {
    const page = (after?: number) => {
      let params = new HttpParams().set('limit', 100);
      if (after) params = params.set('startingAfter', after);
      return this.http.get<ListPage<TuningVersion>>(`${path(tuningId)}/versions`, { params });
    };
    return page().pipe(
      expand((current) => {
        const last = current.data.at(-1);
        return current.hasMore && last ? page(last.version) : EMPTY;
      }),
      reduce((all, current) => all.concat(current.data), [] as TuningVersion[]),
    );
  }

  /** Every edit makes a new version; channels are merged by id. */
  update(tuningId: string, body: TuningUpdate): Observable<Tuning> {
    return this.http.patch<Tuning>(path(tuningId), body);
  }

  remove(tuningId: string): Observable<void> {
    return this.http.delete(path(tuningId)).pipe(map(() => undefined));
  }

  /** Copies `version` into a new latest version; nothing is overwritten. */
  restore(tuningId: string, version: number): Observable<Tuning> {
    return this.http.post<Tuning>(`${path(tuningId)}/versions/${version}/restore`, null);
  }

  duplicate(tuningId: string, name: string, version?: number): Observable<Tuning> {
    const body: DuplicateRequest = version ? { name, version } : { name };
    return this.http.post<Tuning>(`${path(tuningId)}/duplicate`, body);
  }

  /** Differences right minus left; either side may be any version of any tuning. */
  compare(left: TuningSide, right: TuningSide): Observable<TuningComparison> {
    let params = new HttpParams().set('left', left.tuningId).set('right', right.tuningId);
    if (left.version) params = params.set('leftVersion', left.version);
    if (right.version) params = params.set('rightVersion', right.version);
    return this.http.get<TuningComparison>('/v1/tunings/compare', { params });
  }

  /**
   * Coefficient tables for a processor. `profile`: a processor profile id, `none` for exact values, or
   * absent for the room's profile; `sampleRateHz`: absent for the tuning's own rate.
   */
  export(
    tuningId: string,
    format: 'json' | 'csv',
    version?: number,
    options: ExportOptions = {},
  ): Observable<Blob> {
    return this.http.get(`${path(tuningId)}/export`, {
      params: exportParams(format, version, options),
      headers: new HttpHeaders({ Accept: format === 'csv' ? 'text/csv' : 'application/json' }),
      responseType: 'blob',
    });
  }

  /** The JSON export, read rather than downloaded: what rounding cost and the export's cautions. */
  exportPreview(tuningId: string, version?: number, options: ExportOptions = {}): Observable<TuningExport> {
    return this.http.get<TuningExport>(`${path(tuningId)}/export`, {
      params: exportParams('json', version, options),
    });
  }
}

/** A processor export's choices: the contract's query parameters other than the format and version. */
export type ExportOptions = Pick<
  NonNullable<operations['exportTuning']['parameters']['query']>,
  'profile' | 'sampleRateHz'
>;

/** `POST /v1/tunings/{tuningId}/duplicate`. */
type DuplicateRequest = NonNullable<
  operations['duplicateTuning']['requestBody']
>['content']['application/json'];

function exportParams(
  format: 'json' | 'csv',
  version: number | undefined,
  options: ExportOptions,
): HttpParams {
  let params = new HttpParams().set('format', format);
  if (version) params = params.set('version', version);
  if (options.profile) params = params.set('profile', options.profile);
  if (options.sampleRateHz) params = params.set('sampleRateHz', options.sampleRateHz);
  return params;
}
