import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export const KEY_ROLES = ['calculate', 'tuning', 'admin'] as const;
export type KeyRole = (typeof KEY_ROLES)[number];

export class ApiKey extends Model<InferAttributes<ApiKey>, InferCreationAttributes<ApiKey>> {
  declare id: string;
  declare name: string;
  declare role: KeyRole;
  declare kind: CreationOptional<'live' | 'test'>;
  /** Visible start of the key, e.g. `iso_live_Ab3x`; with `lastFour` it identifies a key in lists. */
  declare prefix: string;
  declare lastFour: string;
  /** HMAC-SHA-256 of the clear key with the server secret; the clear key is never stored. */
  declare secretHash: string;
  declare ownerId: string;
  declare createdById: string | null;
  declare rateLimitPerMinute: number | null;
  declare expiresAt: Date | null;
  declare revokedAt: Date | null;
  declare lastUsedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initApiKey(sequelize: Sequelize): typeof ApiKey {
  ApiKey.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false },
      kind: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'live' },
      prefix: { type: DataTypes.STRING(24), allowNull: false },
      lastFour: { type: DataTypes.STRING(4), allowNull: false },
      secretHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      createdById: { type: DataTypes.STRING(40), allowNull: true },
      rateLimitPerMinute: { type: DataTypes.INTEGER, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      lastUsedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'api_keys' },
  );
  return ApiKey;
}
