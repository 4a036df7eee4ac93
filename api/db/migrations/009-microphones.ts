import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Measurement microphones, private to their owner: name, serial, the parsed calibration, the data
 * sheet's sensitivity and the dBFS-to-SPL offset (from that sensitivity or a calibrator recording).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('microphones', {
    id: { type: DataTypes.STRING(40), primaryKey: true },
    ownerId: { type: DataTypes.STRING(40), allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    serial: { type: DataTypes.STRING(64), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    calibration: { type: DataTypes.JSON, allowNull: true },
    sensitivity: { type: DataTypes.JSON, allowNull: true },
    splOffset: { type: DataTypes.JSON, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('microphones', ['ownerId']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('microphones');
}
