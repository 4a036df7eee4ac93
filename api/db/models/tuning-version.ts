import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { TuningChannel, TuningSubwoofer } from '../../../shared/plan/tuning';
import type { TuningPromise, SignOff } from '../../../shared/verification';

export type TuningOrigin = 'settings' | 'plan' | 'edit' | 'restore' | 'duplicate';

/** One immutable version of a tuning: written once, never updated. */
export class TuningVersion extends Model<
  InferAttributes<TuningVersion>,
  InferCreationAttributes<TuningVersion>
> {
  declare id: string;
  declare tuningId: string;
  declare version: number;
  declare name: string;
  declare notes: string | null;
  declare sampleRateHz: number;
  declare channels: TuningChannel[];
  declare subwoofer: TuningSubwoofer | null;
  declare origin: TuningOrigin;
  declare restoredFromVersion: number | null;
  /** The room state revision the settings were made from (edits, restores and copies keep their source's). */
  declare roomRevision: number;
  declare createdByUserId: string | null;
  declare createdByKeyId: string | null;
  /** What the plan this version came from promised (null for settings typed in by hand). */
  declare promise: CreationOptional<TuningPromise | null>;
  /** The engineer's sign-off after verification; the only part of a version set after it is written. */
  declare signOff: CreationOptional<SignOff | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initTuningVersion(sequelize: Sequelize): typeof TuningVersion {
  TuningVersion.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      tuningId: { type: DataTypes.STRING(40), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      sampleRateHz: { type: DataTypes.INTEGER, allowNull: false },
      channels: { type: DataTypes.JSON, allowNull: false },
      subwoofer: { type: DataTypes.JSON, allowNull: true },
      origin: { type: DataTypes.STRING(16), allowNull: false },
      restoredFromVersion: { type: DataTypes.INTEGER, allowNull: true },
      roomRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      createdByKeyId: { type: DataTypes.STRING(40), allowNull: true },
      promise: { type: DataTypes.JSON, allowNull: true },
      signOff: { type: DataTypes.JSON, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'tuning_versions', updatedAt: false },
  );
  return TuningVersion;
}
