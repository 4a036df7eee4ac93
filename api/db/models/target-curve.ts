import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { TargetPoint } from '../../../shared/eq-fit/target-curve';

/** A stored target response: points interpolated on a log-frequency axis, named uniquely per owner. */
export class TargetCurve extends Model<InferAttributes<TargetCurve>, InferCreationAttributes<TargetCurve>> {
  declare id: string;
  declare ownerId: string;
  declare name: string;
  declare notes: string | null;
  declare points: TargetPoint[];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initTargetCurve(sequelize: Sequelize): typeof TargetCurve {
  TargetCurve.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      points: { type: DataTypes.JSON, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'target_curves' },
  );
  return TargetCurve;
}
