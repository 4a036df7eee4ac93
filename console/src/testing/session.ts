import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { permissionsOf } from '../../../api/auth/permissions';
import type { Permission, UserRole } from '../app/auth/roles';
import { SessionService } from '../app/auth/session.service';

/** The permissions the server's own table gives a console user of this role. */
export function rolePermissions(role: UserRole): Permission[] {
  return [...permissionsOf({ kind: 'user', role, userId: 'usr_1' })];
}

/** Signs a user of this role in through the session service, answering its request as the server would. */
export async function signInAs(
  role: UserRole,
  permissions: Permission[] = rolePermissions(role),
  id = 'usr_1',
): Promise<SessionService> {
  const session = TestBed.inject(SessionService);
  const http = TestBed.inject(HttpTestingController);
  const signedIn = firstValueFrom(session.signIn(`${role}@example.test`, 'pw'));
  http.expectOne('/auth/session').flush({ user: { id, email: `${role}@example.test`, role }, permissions });
  await signedIn;
  return session;
}
