import { can, grantableKeyRoles, roleLabel } from './roles';

// The role table follows PRODUCT.md §5: admin = everything, developer = own keys and playground,
// viewer = read-only usage and docs.
describe('can', () => {
  it('gives the admin every management control', () => {
    for (const capability of [
      'keys:manage',
      'keys:all',
      'users:manage',
      'outbox:view',
      'usage:all',
    ] as const) {
      expect(can('admin', capability)).toBe(true);
    }
  });

  it('lets a developer manage own keys but not users, other people’s keys or rate limits', () => {
    expect(can('developer', 'keys:manage')).toBe(true);
    expect(can('developer', 'keys:all')).toBe(false);
    expect(can('developer', 'keys:setRateLimit')).toBe(false);
    expect(can('developer', 'users:manage')).toBe(false);
  });

  it('lets a viewer read everyone’s usage and nothing more', () => {
    expect(can('viewer', 'usage:all')).toBe(true);
  });

  it('gives a viewer no create, revoke or invite control', () => {
    for (const capability of [
      'keys:view',
      'keys:manage',
      'users:manage',
      'outbox:view',
      'calculate:session',
    ] as const) {
      expect(can('viewer', capability)).toBe(false);
    }
  });

  it('gives nobody anything when signed out or with an unknown role', () => {
    expect(can(null, 'keys:view')).toBe(false);
    expect(can(undefined, 'keys:view')).toBe(false);
    expect(can('guest' as never, 'keys:view')).toBe(false);
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
