import { HttpClient, HttpErrorResponse, HttpHeaders, HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, of, shareReplay } from 'rxjs';
import type { OpenApiDocument } from './openapi-types';
import type { RequestDraft } from './request-draft';

/** What came back, kept raw so the page can show exactly what the server said. */
export interface PlaygroundResponse {
  status: number;
  statusText: string;
  headers: Array<[string, string]>;
  bodyText: string;
  /** The parsed body when it was JSON. */
  body?: unknown;
}

export type PlaygroundAuth = { kind: 'session' } | { kind: 'key'; secret: string };

function headerList(headers: HttpHeaders): Array<[string, string]> {
  return headers
    .keys()
    .map((name): [string, string] => [name.toLowerCase(), headers.getAll(name)?.join(', ') ?? ''])
    .sort(([a], [b]) => a.localeCompare(b));
}

function parseBody(text: string, headers: HttpHeaders): unknown {
  if (!/json/i.test(headers.get('content-type') ?? '')) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

@Injectable({ providedIn: 'root' })
export class PlaygroundService {
  private readonly http = inject(HttpClient);
  private document$?: Observable<OpenApiDocument>;

  /** The served contract, fetched once per page load. */
  document(): Observable<OpenApiDocument> {
    this.document$ ??= this.http.get<OpenApiDocument>('/openapi.json').pipe(shareReplay(1));
    return this.document$;
  }

  /**
   * Sends the draft as it stands. With a key the session cookie stays home (`credentials: 'omit'`), so
   * the answer is exactly what that key gets from code.
   */
  send(draft: RequestDraft, auth: PlaygroundAuth): Observable<PlaygroundResponse> {
    let headers = new HttpHeaders({ Accept: 'application/json, application/problem+json;q=0.9, */*;q=0.1' });
    for (const [name, value] of draft.headers) headers = headers.set(name, value);
    if (auth.kind === 'key') headers = headers.set('Authorization', `Bearer ${auth.secret.trim()}`);
    return this.http
      .request(draft.method, draft.url, {
        body: draft.body,
        headers,
        observe: 'response',
        responseType: 'text',
        credentials: auth.kind === 'key' ? 'omit' : 'same-origin',
      })
      .pipe(
        map((response: HttpResponse<string>) => ({
          status: response.status,
          statusText: response.statusText,
          headers: headerList(response.headers),
          bodyText: response.body ?? '',
          body: parseBody(response.body ?? '', response.headers),
        })),
        catchError((error: unknown) => {
          if (!(error instanceof HttpErrorResponse)) throw error;
          const text =
            typeof error.error === 'string' ? error.error : error.error ? JSON.stringify(error.error) : '';
          return of({
            status: error.status,
            statusText: error.status === 0 ? 'No answer' : error.statusText,
            headers: headerList(error.headers),
            bodyText: text,
            body: parseBody(text, error.headers),
          });
        }),
      );
  }
}
