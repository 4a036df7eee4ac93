import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, map, reduce } from 'rxjs';
import { ListPage } from '../keys/key.model';
import {
  ConsoleUser,
  InvitationResult,
  InviteRequest,
  OutboxList,
  OutboxMessage,
  UserChanges,
  UserUpdateResult,
} from './user.model';

@Injectable({ providedIn: 'root' })
export class UsersService {
  private readonly http = inject(HttpClient);

  listAll(): Observable<ConsoleUser[]> {
    const page = (startingAfter?: string) => {
      let params = new HttpParams().set('limit', 100);
      if (startingAfter) params = params.set('startingAfter', startingAfter);
      return this.http.get<ListPage<ConsoleUser>>('/v1/users', { params });
    };
    return page().pipe(
      expand((result) => {
        const last = result.data.at(-1);
        return result.hasMore && last ? page(last.id) : EMPTY;
      }),
      reduce((all, result) => all.concat(result.data), [] as ConsoleUser[]),
    );
  }

  invite(request: InviteRequest): Observable<InvitationResult> {
    return this.http.post<InvitationResult>('/v1/users', request);
  }

  /**
   * A fresh one-time link for someone who has not accepted yet; the old link stops working. Answered
   * like an invitation: the user and the new link.
   */
  reissueInvitation(id: string): Observable<InvitationResult> {
    return this.http.post<InvitationResult>(`/v1/users/${encodeURIComponent(id)}/invitations`, {});
  }

  update(id: string, changes: UserChanges): Observable<UserUpdateResult> {
    return this.http.patch<UserUpdateResult>(`/v1/users/${encodeURIComponent(id)}`, changes);
  }

  outbox(): Observable<OutboxMessage[]> {
    return this.http.get<OutboxList>('/v1/outbox').pipe(map((body) => body.data));
  }
}
