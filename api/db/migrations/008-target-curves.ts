import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Stored target curves: a named list of points (frequency, level) a user reuses in EQ fits and plans.
 * Names are unique per owner, so a request can name one.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('target_curves', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    points: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('target_curves', ['ownerId', 'name'], { unique: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('target_curves');
}
