import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** Calls counted per key (or signed-in user), route, status class and hour. */
export class UsageBucket extends Model<InferAttributes<UsageBucket>, InferCreationAttributes<UsageBucket>> {
  declare id: CreationOptional<number>;
  declare keyId: string;
  declare userId: string;
  declare route: string;
  declare statusClass: string;
  declare bucketStart: Date;
  declare count: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUsageBucket(sequelize: Sequelize): typeof UsageBucket {
  UsageBucket.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      keyId: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
      userId: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
      route: { type: DataTypes.STRING(120), allowNull: false },
      statusClass: { type: DataTypes.STRING(3), allowNull: false },
      bucketStart: { type: DataTypes.DATE, allowNull: false },
      count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'usage_buckets' },
  );
  return UsageBucket;
}
