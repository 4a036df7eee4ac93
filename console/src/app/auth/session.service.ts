import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, map, of, shareReplay, tap } from 'rxjs';
import type { components } from '../../../../shared/contract/api-types';
import { Capability, Permission, can } from './roles';

/** The signed-in console user, as `GET /auth/session` returns it. */
export type SessionUser = components['schemas']['SessionUser'];

/** `GET /auth/session`, `POST /auth/session` and `POST /auth/invitations/accept` answer this. */
type SessionBody = components['schemas']['SessionBody'];

/** Holds who is signed in; every page reads it through signals. */
@Injectable({ providedIn: 'root' })
export class SessionService {
  private readonly http = inject(HttpClient);
  private readonly current = signal<SessionUser | null>(null);
  private readonly granted = signal<Permission[]>([]);
  private readonly resolved = signal(false);
  private pending?: Observable<SessionUser | null>;

  readonly user = this.current.asReadonly();
  readonly known = this.resolved.asReadonly();
  readonly role = computed(() => this.current()?.role ?? null);
  /** The signed-in user's permissions, as the server's session answer lists them. */
  readonly permissions = this.granted.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);

  /** Asks the server once who is signed in; later calls reuse the answer until sign-in or sign-out. */
  load(): Observable<SessionUser | null> {
    if (this.resolved()) return of(this.current());
    this.pending ??= this.http.get<SessionBody>('/auth/session').pipe(
      map((body) => this.take(body)),
      catchError((error: unknown) => {
        if (error instanceof HttpErrorResponse && error.status === 401) return of(null);
        throw error;
      }),
      tap((user) => {
        this.current.set(user);
        this.resolved.set(true);
        this.pending = undefined;
      }),
      shareReplay(1),
    );
    return this.pending;
  }

  signIn(email: string, password: string): Observable<SessionUser> {
    return this.http.post<SessionBody>('/auth/session', { email, password }).pipe(
      map((body) => this.take(body)),
      tap((user) => {
        this.current.set(user);
        this.resolved.set(true);
      }),
    );
  }

  signOut(): Observable<void> {
    return this.http.delete('/auth/session').pipe(
      catchError((error: unknown) => {
        if (error instanceof HttpErrorResponse && error.status === 401) return of(undefined);
        throw error;
      }),
      tap(() => this.forget()),
      map(() => undefined),
    );
  }

  /** Sets the password from an invitation; the server signs the new user in at once. */
  acceptInvitation(token: string, password: string): Observable<SessionUser> {
    return this.http.post<SessionBody>('/auth/invitations/accept', { token, password }).pipe(
      map((body) => this.take(body)),
      tap((user) => {
        this.current.set(user);
        this.resolved.set(true);
      }),
    );
  }

  /** Called when the server says the session has ended (a 401 on a console call). */
  forget(): void {
    this.current.set(null);
    this.granted.set([]);
    this.resolved.set(true);
  }

  can(capability: Capability): boolean {
    return can(this.granted(), capability);
  }

  private take(body: SessionBody): SessionUser {
    this.granted.set(body.permissions ?? []);
    return body.user;
  }
}
