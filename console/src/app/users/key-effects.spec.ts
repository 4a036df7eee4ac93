import { keyEffectsSummary, type KeyRoleEffect } from './key-effects';

type Role = KeyRoleEffect['role'];

const key = (name: string, role: Role, after: Role | null): KeyRoleEffect => ({
  id: `key_${name}`,
  name,
  prefix: 'iso_live_',
  lastFour: 'a1b2',
  role,
  effectiveRoleBefore: role,
  effectiveRoleAfter: after,
});

describe('keyEffectsSummary', () => {
  it('says nothing when no key moved', () => {
    expect(keyEffectsSummary([])).toBe('');
    expect(keyEffectsSummary(undefined)).toBe('');
  });

  it('names refused keys and keys lowered to another role', () => {
    expect(keyEffectsSummary([key('Rig', 'tuning', null), key('Farm', 'calculate', null)])).toBe(
      'Keys “Rig”, “Farm” are now refused.',
    );
    expect(keyEffectsSummary([key('Release', 'admin', 'tuning')])).toBe('Key “Release” now acts as tuning.');
    expect(
      keyEffectsSummary([
        key('Release', 'admin', 'tuning'),
        key('Nightly', 'admin', 'tuning'),
        key('Rig', 'tuning', null),
      ]),
    ).toBe('Key “Rig” is now refused; keys “Release”, “Nightly” now act as tuning.');
  });
});
