import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { MicrophoneCalibration, MicrophoneSensitivity } from '../../../shared/capture/microphone';

/** The stored calibration: the parsed columns and the file they came from. */
export interface StoredCalibration extends MicrophoneCalibration {
  fileName: string | null;
}

/** dB SPL = dBFS + offsetDb, and where the offset came from. */
export interface SplOffset {
  offsetDb: number;
  source: 'sensitivity' | 'calibrator';
  calibratorLevelDb?: number;
  measuredFrequencyHz?: number;
  rmsDbfs?: number;
  inputGain?: string | null;
  measuredAt?: string;
}

/** A measurement microphone, private to its owner. */
export class Microphone extends Model<InferAttributes<Microphone>, InferCreationAttributes<Microphone>> {
  declare id: string;
  declare ownerId: string;
  declare name: string;
  declare serial: string | null;
  declare notes: string | null;
  declare calibration: StoredCalibration | null;
  declare sensitivity: MicrophoneSensitivity | null;
  declare splOffset: SplOffset | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMicrophone(sequelize: Sequelize): typeof Microphone {
  Microphone.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      serial: { type: DataTypes.STRING(64), allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      calibration: { type: DataTypes.JSON, allowNull: true },
      sensitivity: { type: DataTypes.JSON, allowNull: true },
      splOffset: { type: DataTypes.JSON, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'microphones' },
  );
  return Microphone;
}
