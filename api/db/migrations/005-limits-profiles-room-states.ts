import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

/**
 * Processor profiles (per owner, chosen per room) and the history of what a tuning depends on in its
 * room. Every room gets `profileId` and `stateRevision`; `room_states` keeps each revision's state
 * (listener, loudspeaker positions, limits, sample rate, profile) with the time it began, and every
 * tuning version records the revision it was made from, so a tuning made from an older state can say
 * it is stale and since when. Existing rooms start at revision 1 (their state now); existing versions
 * are taken to be made from it.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('processor_profiles', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    settings: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('processor_profiles', ['ownerId']);
  await qi.addColumn('rooms', 'profileId', {
    type: DataTypes.STRING(40),
    allowNull: true,
    references: { model: 'processor_profiles', key: 'id' },
  });
  await qi.addColumn('rooms', 'stateRevision', {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 1,
  });
  await qi.createTable('room_states', {
    roomId: {
      type: DataTypes.STRING(40),
      primaryKey: true,
      references: { model: 'rooms', key: 'id' },
    },
    revision: { type: DataTypes.INTEGER, primaryKey: true },
    state: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addColumn('tuning_versions', 'roomRevision', {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 1,
  });

  // Quoted names: PostgreSQL folds unquoted ones to lower case. JSON columns come back as text from
  // SQLite and already parsed from PostgreSQL.
  const rooms = await qi.sequelize.query<{
    id: string;
    listener: unknown;
    loudspeakers: unknown;
    limits: unknown;
    sampleRateHz: number;
    updatedAt: string | Date;
  }>('SELECT id, listener, loudspeakers, limits, "sampleRateHz", "updatedAt" FROM rooms', {
    type: QueryTypes.SELECT,
  });
  const json = (value: unknown): unknown => (typeof value === 'string' ? JSON.parse(value) : value);
  for (const room of rooms) {
    const state = {
      listener: json(room.listener),
      loudspeakers: (json(room.loudspeakers) as Array<{ id: string; x: number; y: number; z: number }>).map(
        ({ id, x, y, z }) => ({ id, x, y, z }),
      ),
      limits: room.limits === null ? null : json(room.limits),
      sampleRateHz: room.sampleRateHz,
      profile: null,
    };
    await qi.bulkInsert('room_states', [
      { roomId: room.id, revision: 1, state: JSON.stringify(state), createdAt: room.updatedAt },
    ]);
  }
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('tuning_versions', 'roomRevision');
  await qi.dropTable('room_states');
  await qi.removeColumn('rooms', 'stateRevision');
  await qi.removeColumn('rooms', 'profileId');
  await qi.dropTable('processor_profiles');
}
