import { generateKeySecret, hashKeySecret } from '../api/auth/key-secret';
import { hashPassword } from '../api/auth/password';
import { newId } from '../api/db/ids';
import type { KeyRole } from '../api/db/models/api-key';
import type { UserRole } from '../api/db/models/user';
import type { Services } from '../api/services';

/** Demo-only password of the three demo users; printed in the README, never used in production. */
export const DEMO_PASSWORD = 'kestrel-demo';

export const DEMO_USERS: Array<{ email: string; name: string; role: UserRole }> = [
  { email: 'admin@kestrel.example', name: 'Demo admin (Kestrel Yard Post)', role: 'admin' },
  { email: 'dev@kestrel.example', name: 'Demo developer (Kestrel Yard Post)', role: 'developer' },
  { email: 'viewer@kestrel.example', name: 'Demo viewer (Kestrel Yard Post)', role: 'viewer' },
];

const DEMO_KEYS: Array<{ name: string; role: KeyRole; owner: string }> = [
  { name: 'Sweep rig — Stage 3', role: 'tuning', owner: 'dev@kestrel.example' },
  { name: 'Render farm checks', role: 'calculate', owner: 'admin@kestrel.example' },
];

/**
 * The invented Kestrel Yard Post users and keys. The demo keys' clear secrets are thrown away at once:
 * they exist to populate lists; create your own key with the console or `npm run isochron -- keys create`.
 */
export async function seedDemoPlatform(services: Services): Promise<void> {
  const { User, ApiKey } = services.db.models;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await services.db.write(async (transaction) => {
    const ids = new Map<string, string>();
    for (const user of DEMO_USERS) {
      const id = newId('usr');
      ids.set(user.email, id);
      await User.create({ id, ...user, status: 'active', passwordHash, lastSignInAt: null }, { transaction });
    }
    const idOf = (email: string): string => {
      const id = ids.get(email);
      if (!id) throw new Error(`demo key owner ${email} is not a demo user`);
      return id;
    };
    for (const key of DEMO_KEYS) {
      const { secret, prefix, lastFour } = generateKeySecret('live');
      await ApiKey.create(
        {
          id: newId('key'),
          name: key.name,
          role: key.role,
          prefix,
          lastFour,
          secretHash: hashKeySecret(secret, services.config.keyHashSecret),
          ownerId: idOf(key.owner),
          createdById: idOf('admin@kestrel.example'),
          rateLimitPerMinute: null,
          expiresAt: null,
          revokedAt: null,
          lastUsedAt: null,
        },
        { transaction },
      );
    }
  });
}
