import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, map, reduce } from 'rxjs';
import { ListPage } from '../keys/key.model';
import { Layout, ProcessorProfile, Room, RoomCreate, RoomUpdate, Tuning } from './room.model';

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

  create(body: RoomCreate): Observable<Room> {
    return this.http.post<Room>('/v1/rooms', body);
  }

  /** Fields given replace the stored ones; stored tunings are not changed. */
  update(id: string, body: RoomUpdate): Observable<Room> {
    return this.http.patch<Room>(`/v1/rooms/${encodeURIComponent(id)}`, body);
  }

  /** The ITU-R BS.2051 layouts (and 9.1.6) the API knows. */
  layouts(): Observable<Layout[]> {
    return this.http.get<ListPage<Layout>>('/v1/layouts').pipe(map((page) => page.data));
  }

  /** The caller's processor profiles, for the room's profile choice. */
  profiles(): Observable<ProcessorProfile[]> {
    return allPages((after) =>
      this.http.get<ListPage<ProcessorProfile>>('/v1/processor-profiles', { params: pageParams(after) }),
    );
  }

  profile(id: string): Observable<ProcessorProfile> {
    return this.http.get<ProcessorProfile>(`/v1/processor-profiles/${encodeURIComponent(id)}`);
  }
}
