import type { UserUpdateResult } from './user.model';

/** One key whose effective role a change of its owner's role moved (the `keys` of `PATCH /v1/users/{id}`). */
export type KeyRoleEffect = NonNullable<UserUpdateResult['keys']>[number];

/** A sentence for the admin who changed the role: what happened to the user's keys, or '' when nothing. */
export function keyEffectsSummary(keys: readonly KeyRoleEffect[] | undefined): string {
  if (!keys || keys.length === 0) return '';
  const stopped = keys.filter((k) => k.effectiveRoleAfter === null);
  const changed = keys.filter((k) => k.effectiveRoleAfter !== null);
  const quote = (list: readonly KeyRoleEffect[]) => list.map((k) => `“${k.name}”`).join(', ');
  const parts: string[] = [];
  if (stopped.length > 0) {
    const one = stopped.length === 1;
    parts.push(`${one ? 'key' : 'keys'} ${quote(stopped)} ${one ? 'is' : 'are'} now refused`);
  }
  for (const role of [...new Set(changed.map((k) => k.effectiveRoleAfter))]) {
    const group = changed.filter((k) => k.effectiveRoleAfter === role);
    const one = group.length === 1;
    parts.push(`${one ? 'key' : 'keys'} ${quote(group)} now ${one ? 'acts' : 'act'} as ${role}`);
  }
  const sentence = parts.join('; ');
  return sentence.charAt(0).toUpperCase() + sentence.slice(1) + '.';
}
