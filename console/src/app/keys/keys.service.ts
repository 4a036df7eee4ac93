import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, expand, reduce } from 'rxjs';
import { ApiKey, CreatedKey, KeyChanges, ListPage, NewKeyRequest } from './key.model';

const PAGE_SIZE = 100;

@Injectable({ providedIn: 'root' })
export class KeysService {
  private readonly http = inject(HttpClient);

  /** Every key visible to the signed-in user, following the cursor until `hasMore` is false. */
  listAll(includeRevoked = false): Observable<ApiKey[]> {
    const page = (startingAfter?: string) => {
      let params = new HttpParams().set('limit', PAGE_SIZE);
      if (includeRevoked) params = params.set('includeRevoked', true);
      if (startingAfter) params = params.set('startingAfter', startingAfter);
      return this.http.get<ListPage<ApiKey>>('/v1/keys', { params });
    };
    return page().pipe(
      expand((result) => {
        const last = result.data.at(-1);
        return result.hasMore && last ? page(last.id) : EMPTY;
      }),
      reduce((all, result) => all.concat(result.data), [] as ApiKey[]),
    );
  }

  create(request: NewKeyRequest): Observable<CreatedKey> {
    return this.http.post<CreatedKey>('/v1/keys', request);
  }

  update(id: string, changes: KeyChanges): Observable<ApiKey> {
    return this.http.patch<ApiKey>(`/v1/keys/${encodeURIComponent(id)}`, changes);
  }

  /** Answers with the revoked key (its `revokedAt` set). */
  revoke(id: string): Observable<ApiKey> {
    return this.http.delete<ApiKey>(`/v1/keys/${encodeURIComponent(id)}`);
  }
}
