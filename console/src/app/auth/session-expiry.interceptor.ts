import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { SessionService } from './session.service';

/** Calls that carry an explicit key are the playground's; their 401s belong to the caller. */
function usesSession(url: string, hasAuthorization: boolean): boolean {
  return !hasAuthorization && url.startsWith('/v1/');
}

/** When a console call comes back 401 the session has ended: send the person to sign in again. */
export const sessionExpiryInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(SessionService);
  const router = inject(Router);
  return next(request).pipe(
    catchError((error: unknown) => {
      if (
        error instanceof HttpErrorResponse &&
        error.status === 401 &&
        usesSession(request.url, request.headers.has('Authorization')) &&
        session.signedIn()
      ) {
        session.forget();
        void router.navigate(['/sign-in'], { queryParams: { next: router.url, expired: 1 } });
      }
      return throwError(() => error);
    }),
  );
};
