import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import { Capability, can } from './roles';
import { SessionService } from './session.service';

/** Pages behind sign-in: unknown visitors go to the sign-in page and come back afterwards. */
export const requireSession: CanActivateFn = (_route, state) => {
  const session = inject(SessionService);
  const router = inject(Router);
  return session.load().pipe(
    map((user) => user !== null || router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } })),
    catchError(() => of(router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } }))),
  );
};

/** Pages only some roles may open (the server refuses the calls anyway). */
export function requireCapability(capability: Capability): CanActivateFn {
  return () => {
    const session = inject(SessionService);
    const router = inject(Router);
    return session.load().pipe(map((user) => can(user?.role, capability) || router.createUrlTree(['/'])));
  };
}

/** The sign-in page is pointless when already signed in. */
export const redirectWhenSignedIn: CanActivateFn = () => {
  const session = inject(SessionService);
  const router = inject(Router);
  return session.load().pipe(
    map((user) => (user ? router.createUrlTree(['/']) : true)),
    catchError(() => of(true)),
  );
};
