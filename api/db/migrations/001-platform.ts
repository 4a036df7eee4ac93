import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('users', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: true },
    role: { type: DataTypes.STRING(16), allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'active' },
    passwordHash: { type: DataTypes.STRING(255), allowNull: true },
    lastSignInAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });

  await qi.createTable('api_keys', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    kind: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'live' },
    prefix: { type: DataTypes.STRING(24), allowNull: false },
    lastFour: { type: DataTypes.STRING(4), allowNull: false },
    secretHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    createdById: { type: DataTypes.STRING(40), allowNull: true },
    rateLimitPerMinute: { type: DataTypes.INTEGER, allowNull: true },
    expiresAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    lastUsedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('api_keys', ['ownerId']);

  await qi.createTable('usage_buckets', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    // '' rather than NULL: SQLite treats NULLs as distinct in a unique index, which would split buckets.
    keyId: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    userId: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    route: { type: DataTypes.STRING(120), allowNull: false },
    statusClass: { type: DataTypes.STRING(3), allowNull: false },
    bucketStart: { type: DataTypes.DATE, allowNull: false },
    count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex('usage_buckets', ['keyId', 'userId', 'route', 'statusClass', 'bucketStart'], {
    unique: true,
    name: 'usage_buckets_identity',
  });
  await qi.addIndex('usage_buckets', ['bucketStart']);

  await qi.createTable('audit_events', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    action: { type: DataTypes.STRING(64), allowNull: false },
    actorUserId: { type: DataTypes.STRING(40), allowNull: true },
    actorKeyId: { type: DataTypes.STRING(40), allowNull: true },
    targetType: { type: DataTypes.STRING(32), allowNull: true },
    targetId: { type: DataTypes.STRING(64), allowNull: true },
    details: { type: DataTypes.TEXT, allowNull: true },
    ipAddress: { type: DataTypes.STRING(64), allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('audit_events', ['createdAt']);

  await qi.createTable('invitations', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    userId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdById: { type: DataTypes.STRING(40), allowNull: true },
    ...timestamps,
  });

  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of ['sessions', 'invitations', 'audit_events', 'usage_buckets', 'api_keys', 'users']) {
    await qi.dropTable(table);
  }
}
