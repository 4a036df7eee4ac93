import type { components } from '../../../shared/contract/api-types';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export type MeasurementKind = 'impulseResponse' | 'frequencyResponse' | 'spl';
/** Taken before a tuning was loaded (raw, plans use it) or after (verification uses it). */
export type MeasurementStage = 'before' | 'after';

/** What was uploaded: the file's name and, for audio, its format (the audio itself is not kept). */
/** What a measurement stores as its `result`, as the contract describes it (one shape per kind). */
export type MeasurementResult = NonNullable<components['schemas']['Measurement']['result']>;

/** What was uploaded, as the contract describes it (the audio itself is not kept). */
export type MeasurementSource = components['schemas']['Measurement']['source'];

/**
 * One measurement of one loudspeaker (channel) at one microphone position in a room: an impulse
 * response's analysis, a frequency response, or an SPL reading. Written once, never updated.
 */
export class Measurement extends Model<InferAttributes<Measurement>, InferCreationAttributes<Measurement>> {
  declare id: string;
  declare roomId: string;
  declare ownerId: string;
  declare channel: string;
  declare micPosition: string;
  declare kind: MeasurementKind;
  declare name: string | null;
  declare notes: string | null;
  declare source: MeasurementSource;
  /** The analysis (impulse response), the response arrays (frequency response) or the reading (SPL). */
  declare result: MeasurementResult;
  declare createdByKeyId: string | null;
  /** The tuning (and version) loaded in the processor when it was taken, if any. */
  declare tuningId: CreationOptional<string | null>;
  declare tuningVersion: CreationOptional<number | null>;
  declare stage: CreationOptional<MeasurementStage | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMeasurement(sequelize: Sequelize): typeof Measurement {
  Measurement.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      roomId: { type: DataTypes.STRING(40), allowNull: false },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      channel: { type: DataTypes.STRING(32), allowNull: false },
      micPosition: { type: DataTypes.STRING(32), allowNull: false },
      kind: { type: DataTypes.STRING(24), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      source: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON, allowNull: false },
      createdByKeyId: { type: DataTypes.STRING(40), allowNull: true },
      tuningId: { type: DataTypes.STRING(40), allowNull: true },
      tuningVersion: { type: DataTypes.INTEGER, allowNull: true },
      stage: { type: DataTypes.STRING(8), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'measurements' },
  );
  return Measurement;
}
