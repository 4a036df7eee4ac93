import type { Request } from 'express';
import type { Principal } from './permissions';

/**
 * Who a service acts for. Services take an actor, never an Express request: the same service serves
 * the HTTP API (a caller: an API key or a signed-in user), the `/auth` pages (a visitor who is not
 * signed in yet) and the operator command line.
 */
export type Actor =
  | { kind: 'caller'; principal: Principal; ip: string | null }
  | { kind: 'visitor'; ip: string | null }
  | { kind: 'operator' };

/** The actor behind a request: its principal when authenticated, else a visitor from its address. */
export function actorOf(req: Request): Actor {
  const ip = req.ip ?? null;
  return req.principal ? { kind: 'caller', principal: req.principal, ip } : { kind: 'visitor', ip };
}

/** The caller of an authenticated request; `/v1` routes run behind authentication. */
export function callerOf(req: Request): Extract<Actor, { kind: 'caller' }> {
  if (!req.principal) throw new Error('No principal: the route is not behind authentication');
  return { kind: 'caller', principal: req.principal, ip: req.ip ?? null };
}

/** The user an actor acts as, if any. */
export const actorUserId = (actor: Actor): string | null =>
  actor.kind === 'caller' ? actor.principal.userId : null;
