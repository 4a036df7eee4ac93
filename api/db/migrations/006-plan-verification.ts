import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The measure → plan → verify loop: a measurement may say which tuning version was loaded when it was
 * taken and whether it was taken before or after (so "after" measurements never feed a new plan and
 * verification finds them); a tuning version keeps what its plan promised (reference level, expected
 * levels, corrected ranges, predicted subwoofer sum) and, once verified, the engineer's sign-off.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('measurements', 'tuningId', { type: DataTypes.STRING(40), allowNull: true });
  await qi.addColumn('measurements', 'tuningVersion', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('measurements', 'stage', { type: DataTypes.STRING(8), allowNull: true });
  await qi.addIndex('measurements', ['tuningId', 'tuningVersion'], { name: 'measurements_tuning' });
  await qi.addColumn('tuning_versions', 'promise', { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn('tuning_versions', 'signOff', { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('tuning_versions', 'signOff');
  await qi.removeColumn('tuning_versions', 'promise');
  await qi.removeIndex('measurements', 'measurements_tuning');
  for (const column of ['stage', 'tuningVersion', 'tuningId']) await qi.removeColumn('measurements', column);
}
