import type { components } from '../../../shared/contract/api-types';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export interface StoredLoudspeaker {
  id: string;
  name?: string;
  x: number;
  y: number;
  z: number;
}

/** The processor's limits a room stores, as the contract's `Limits` gives them. */
export type StoredLimits = components['schemas']['Limits'];

/** A listening room: dimensions, listening position, loudspeakers and the processor's limits. */
export class Room extends Model<InferAttributes<Room>, InferCreationAttributes<Room>> {
  declare id: string;
  declare ownerId: string;
  declare name: string;
  declare layoutId: string;
  declare dimensions: { widthM: number; lengthM: number; heightM: number };
  declare listener: { x: number; y: number; z: number };
  declare loudspeakers: StoredLoudspeaker[];
  declare limits: StoredLimits | null;
  declare sampleRateHz: number;
  /** The processor profile the room's tunings are checked against and exported for, if any. */
  declare profileId: CreationOptional<string | null>;
  /** Revision of the room's state (room_states) that its tunings are compared with. */
  declare stateRevision: CreationOptional<number>;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initRoom(sequelize: Sequelize): typeof Room {
  Room.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      ownerId: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      layoutId: { type: DataTypes.STRING(32), allowNull: false },
      dimensions: { type: DataTypes.JSON, allowNull: false },
      listener: { type: DataTypes.JSON, allowNull: false },
      loudspeakers: { type: DataTypes.JSON, allowNull: false },
      limits: { type: DataTypes.JSON, allowNull: true },
      sampleRateHz: { type: DataTypes.INTEGER, allowNull: false },
      profileId: { type: DataTypes.STRING(40), allowNull: true, defaultValue: null },
      stateRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'rooms' },
  );
  return Room;
}
