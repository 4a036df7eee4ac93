import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, reduce } from 'rxjs';
import { ListPage } from '../keys/key.model';
import { Room, Tuning } from './room.model';

export function allPages<T extends { id: string }>(
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
}
