import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ProcessorProfileSettings } from '../../../shared/processor/profile';

/** What one kind of speaker processor accepts; owned by a user, chosen by that user's rooms. */
export class ProcessorProfileRow extends Model<
  InferAttributes<ProcessorProfileRow>,
  InferCreationAttributes<ProcessorProfileRow>
> {
  declare id: string;
  declare ownerId: string;
  declare name: string;
  declare settings: ProcessorProfileSettings;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initProcessorProfile(sequelize: Sequelize): typeof ProcessorProfileRow {
  ProcessorProfileRow.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      settings: { type: DataTypes.JSON, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'processor_profiles' },
  );
  return ProcessorProfileRow;
}
