import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A scratch table that readiness writes a page-sized row into and removes again in one transaction, so
 * `/readyz` proves that the database file can really be written (a full disk or a read-only file shows).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('storage_probe', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    pad: { type: DataTypes.BLOB, allowNull: true },
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('storage_probe');
}
