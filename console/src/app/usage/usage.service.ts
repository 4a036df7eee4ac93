import { HttpClient, HttpHeaders, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { UsageQuery, UsageResponse, UsageRow } from './usage.model';

function toParams(query: UsageQuery): HttpParams {
  let params = new HttpParams().set('from', query.from).set('to', query.to).set('groupBy', query.groupBy);
  if (query.keyId) params = params.set('keyId', query.keyId);
  if (query.route) params = params.set('route', query.route);
  return params;
}

@Injectable({ providedIn: 'root' })
export class UsageService {
  private readonly http = inject(HttpClient);

  rows(query: UsageQuery): Observable<UsageRow[]> {
    return this.report(query).pipe(map((body) => body.data));
  }

  /** The rows with the limits in force. */
  report(query: UsageQuery): Observable<UsageResponse> {
    return this.http.get<UsageResponse>('/v1/usage', { params: toParams(query) });
  }

  /** The same rows as CSV, as the server formats them for spreadsheets. */
  csv(query: UsageQuery): Observable<Blob> {
    return this.http.get('/v1/usage', {
      params: toParams(query),
      headers: new HttpHeaders({ Accept: 'text/csv' }),
      responseType: 'blob',
    });
  }
}
