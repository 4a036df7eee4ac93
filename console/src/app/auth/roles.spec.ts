import { permissionsOf } from '../../../../api/auth/permissions';
import { CAPABILITY_NEEDS, Capability, PERMISSION_WORDS, can, grantableKeyRoles, roleLabel } from './roles';

// The console has no role table: it reads the permissions the server's own table gives a user (the
// session answer carries them), so these checks run against that table itself.
const of = (role: 'admin' | 'developer' | 'viewer') => permissionsOf({ kind: 'user', role, userId: 'usr_1' });

describe('can', () => {
  it('gives the admin every capability', () => {
    for (const capability of Object.keys(CAPABILITY_NEEDS) as Capability[]) {
      expect([capability, can(of('admin'), capability)]).toEqual([capability, true]);
    }
  });

  it('lets a developer manage own keys and rooms but not users, other people’s keys or rate limits', () => {
    const dev = of('developer');
    expect(can(dev, 'keys:manage')).toBe(true);
    expect(can(dev, 'rooms:view')).toBe(true);
    expect(can(dev, 'calculate:session')).toBe(true);
    expect(can(dev, 'keys:all')).toBe(false);
    expect(can(dev, 'keys:setRateLimit')).toBe(false);
    expect(can(dev, 'users:manage')).toBe(false);
  });

  it('lets a viewer read everyone’s usage and nothing more', () => {
    const viewer = of('viewer');
    expect(can(viewer, 'usage:all')).toBe(true);
    for (const capability of [
      'keys:view',
      'keys:manage',
      'users:manage',
      'outbox:view',
      'calculate:session',
      'rooms:view',
    ] as const) {
      expect(can(viewer, capability)).toBe(false);
    }
  });

  it('gives nobody anything when signed out', () => {
    expect(can(null, 'keys:view')).toBe(false);
    expect(can([], 'usage:all')).toBe(false);
  });

  it('has words for every permission the server can grant', () => {
    for (const permission of of('admin')) expect(PERMISSION_WORDS[permission].what).toBeTruthy();
  });
});

describe('grantableKeyRoles', () => {
  it('never offers a key stronger than the user', () => {
    expect(grantableKeyRoles('admin')).toEqual(['calculate', 'tuning', 'admin']);
    expect(grantableKeyRoles('developer')).toEqual(['calculate', 'tuning']);
    expect(grantableKeyRoles('viewer')).toEqual([]);
  });
});

describe('roleLabel', () => {
  it('capitalises known roles and passes unknown ones through', () => {
    expect(roleLabel('tuning')).toBe('Tuning');
    expect(roleLabel('auditor')).toBe('auditor');
  });
});
