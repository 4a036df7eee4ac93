import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A named, versioned set of corrections for a room. The settings themselves live in TuningVersion. */
export class Tuning extends Model<InferAttributes<Tuning>, InferCreationAttributes<Tuning>> {
  declare id: string;
  declare roomId: string;
  declare ownerId: string;
  declare name: string;
  declare currentVersion: number;
  declare duplicatedFromId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initTuning(sequelize: Sequelize): typeof Tuning {
  Tuning.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      roomId: { type: DataTypes.STRING(40), allowNull: false },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      currentVersion: { type: DataTypes.INTEGER, allowNull: false },
      duplicatedFromId: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'tunings' },
  );
  return Tuning;
}
