import type { components } from '../../shared/contract/api-types';
import { checkProcessorProfile } from '../../shared/processor/check-profile';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import type { ProcessorProfileRow } from '../db/models/processor-profile';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import { conflict, notFound } from '../http/problem';
import { ownerScope, type Caller } from '../rooms/room-access';
import { isAdmin } from '../auth/permissions';
import { recordRoomState } from '../rooms/room-state-store';

type ProfileInput = components['schemas']['ProcessorProfileSettings'];
export type ProfileView = ReturnType<typeof profileDto>;

/** The API shape of a stored profile. */
export function profileDto(row: ProcessorProfileRow) {
  return {
    id: row.id,
    ownerId: row.ownerId,
    name: row.name,
    ...row.settings,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

function settingsOf(input: ProfileInput): ProcessorProfileRow['settings'] {
  const { name: _name, ...settings } = input;
  return settings;
}

/**
 * Processor profiles, stored per owner (admins see all). A profile that a room uses cannot be deleted;
 * replacing it records a new state for every room that uses it, so their older tunings turn stale.
 */
export class ProfilesService {
  constructor(private readonly db: Database) {}

  list(caller: Caller, page: PageRequest): Promise<Page<ProfileView>> {
    return pageOf(this.db.models.ProcessorProfile, ownerScope(caller), page, profileDto);
  }

  async find(caller: Caller, profileId: string): Promise<ProcessorProfileRow> {
    const row = await this.db.models.ProcessorProfile.findByPk(profileId);
    if (!row || !(isAdmin(caller.principal) || row.ownerId === caller.principal.userId)) {
      throw notFound(`No processor profile ${profileId}.`);
    }
    return row;
  }

  async get(caller: Caller, profileId: string): Promise<ProfileView> {
    return profileDto(await this.find(caller, profileId));
  }

  async create(caller: Caller, input: ProfileInput): Promise<ProfileView> {
    checkProcessorProfile(input);
    const row = await this.db.write((transaction) =>
      this.db.models.ProcessorProfile.create(
        {
          id: newId('prof'),
          ownerId: caller.principal.userId,
          name: input.name,
          settings: settingsOf(input),
        },
        { transaction },
      ),
    );
    return profileDto(row);
  }

  async replace(caller: Caller, profileId: string, input: ProfileInput): Promise<ProfileView> {
    const found = await this.find(caller, profileId);
    checkProcessorProfile(input);
    const row = await this.db.write(async (transaction) => {
      const row = await this.db.models.ProcessorProfile.findByPk(found.id, { transaction });
      if (!row) throw notFound(`No processor profile ${profileId}.`);
      await row.update({ name: input.name, settings: settingsOf(input) }, { transaction });
      const rooms = await this.db.models.Room.findAll({ where: { profileId: row.id }, transaction });
      for (const room of rooms) await recordRoomState(this.db.models, room, transaction);
      return row;
    });
    return profileDto(row);
  }

  async delete(caller: Caller, profileId: string): Promise<void> {
    const found = await this.find(caller, profileId);
    await this.db.write(async (transaction) => {
      const users = await this.db.models.Room.findAll({
        where: { profileId: found.id },
        attributes: ['id'],
        transaction,
      });
      if (users.length > 0) {
        throw conflict(
          `Processor profile ${found.id} is used by ${users.map((r) => r.id).join(', ')}; choose another profile for those rooms first.`,
        );
      }
      await found.destroy({ transaction });
    });
  }
}
