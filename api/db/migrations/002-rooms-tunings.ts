import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

/**
 * Rooms, tunings and their immutable versions. A tuning row holds what changes (name, current version
 * number); every set of per-channel settings lives in exactly one tuning_versions row that is never
 * updated, so any version can be read or restored later.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('rooms', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    layoutId: { type: DataTypes.STRING(32), allowNull: false },
    dimensions: { type: DataTypes.JSON, allowNull: false },
    listener: { type: DataTypes.JSON, allowNull: false },
    loudspeakers: { type: DataTypes.JSON, allowNull: false },
    limits: { type: DataTypes.JSON, allowNull: true },
    sampleRateHz: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 48000 },
    notes: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('rooms', ['ownerId']);

  await qi.createTable('tunings', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    roomId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'rooms', key: 'id' } },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    currentVersion: { type: DataTypes.INTEGER, allowNull: false },
    duplicatedFromId: { type: DataTypes.STRING(40), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('tunings', ['roomId']);
  await qi.addIndex('tunings', ['ownerId']);

  await qi.createTable('tuning_versions', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    tuningId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'tunings', key: 'id' } },
    version: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    sampleRateHz: { type: DataTypes.INTEGER, allowNull: false },
    channels: { type: DataTypes.JSON, allowNull: false },
    subwoofer: { type: DataTypes.JSON, allowNull: true },
    origin: { type: DataTypes.STRING(16), allowNull: false },
    restoredFromVersion: { type: DataTypes.INTEGER, allowNull: true },
    createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
    createdByKeyId: { type: DataTypes.STRING(40), allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('tuning_versions', ['tuningId', 'version'], {
    unique: true,
    name: 'tuning_versions_identity',
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of ['tuning_versions', 'tunings', 'rooms']) await qi.dropTable(table);
}
