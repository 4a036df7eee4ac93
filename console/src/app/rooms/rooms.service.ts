import { HttpClient, HttpHeaders, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, reduce } from 'rxjs';
import { ListPage } from '../keys/key.model';
import { Room, Tuning, TuningComparison } from './room.model';

function allPages<T extends { id: string }>(
  fetchPage: (startingAfter?: string) => Observable<ListPage<T>>,
): Observable<T[]> {
  return fetchPage().pipe(
    expand((page) => {
      const last = page.data.at(-1);
      return page.hasMore && last ? fetchPage(last.id) : EMPTY;
    }),
    reduce((all, page) => all.concat(page.data), [] as T[]),
  );
}

function pageParams(startingAfter?: string): HttpParams {
  const params = new HttpParams().set('limit', 100);
  return startingAfter ? params.set('startingAfter', startingAfter) : params;
}

@Injectable({ providedIn: 'root' })
export class RoomsService {
  private readonly http = inject(HttpClient);

  rooms(): Observable<Room[]> {
    return allPages((after) => this.http.get<ListPage<Room>>('/v1/rooms', { params: pageParams(after) }));
  }

  room(id: string): Observable<Room> {
    return this.http.get<Room>(`/v1/rooms/${encodeURIComponent(id)}`);
  }

  tunings(roomId: string): Observable<Tuning[]> {
    return allPages((after) =>
      this.http.get<ListPage<Tuning>>(`/v1/rooms/${encodeURIComponent(roomId)}/tunings`, {
        params: pageParams(after),
      }),
    );
  }

  /** A new tuning with the same settings, to try a variant without touching the original. */
  duplicate(tuningId: string, name: string): Observable<Tuning> {
    return this.http.post<Tuning>(`/v1/tunings/${encodeURIComponent(tuningId)}/duplicate`, { name });
  }

  compare(leftId: string, rightId: string): Observable<TuningComparison> {
    const params = new HttpParams().set('left', leftId).set('right', rightId);
    return this.http.get<TuningComparison>('/v1/tunings/compare', { params });
  }

  /** Coefficient tables for a processor, designed at the tuning's sample rate. */
  export(tuningId: string, format: 'json' | 'csv'): Observable<Blob> {
    return this.http.get(`/v1/tunings/${encodeURIComponent(tuningId)}/export`, {
      params: new HttpParams().set('format', format),
      headers: new HttpHeaders({ Accept: format === 'csv' ? 'text/csv' : 'application/json' }),
      responseType: 'blob',
    });
  }
}
