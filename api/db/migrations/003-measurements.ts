import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Measurements of a room's loudspeakers: one row per upload (impulse-response analysis, frequency
 * response or SPL reading), tied to the room and its owner. Rows are written once and never updated.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('measurements', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    roomId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'rooms', key: 'id' } },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    channel: { type: DataTypes.STRING(32), allowNull: false },
    micPosition: { type: DataTypes.STRING(32), allowNull: false },
    kind: { type: DataTypes.STRING(24), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    source: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    createdByKeyId: { type: DataTypes.STRING(40), allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('measurements', ['roomId', 'channel']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('measurements');
}
