import { inject } from '@angular/core';
import { CanActivateFn, RedirectCommand, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import { CAPABILITY_NEEDS, Capability } from './roles';
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

/**
 * Pages only some users may open (the server refuses the calls anyway). Anyone else gets a plain page
 * saying what the page needs, at the address they asked for, instead of a silent jump elsewhere.
 */
export function requireCapability(capability: Capability): CanActivateFn {
  return (_route, state) => {
    const session = inject(SessionService);
    const router = inject(Router);
    return session.load().pipe(
      map(
        () =>
          session.can(capability) ||
          new RedirectCommand(
            router.createUrlTree(['/needs-permission'], {
              queryParams: { needs: CAPABILITY_NEEDS[capability], page: state.url },
            }),
            { skipLocationChange: true },
          ),
      ),
    );
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
