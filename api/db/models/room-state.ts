import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { RoomState } from '../../../shared/plan/room-state';

/** One revision of what a room's tunings depend on; written once when the room's state changes. */
export class RoomStateRow extends Model<
  InferAttributes<RoomStateRow>,
  InferCreationAttributes<RoomStateRow>
> {
  declare roomId: string;
  declare revision: number;
  declare state: RoomState;
  declare createdAt: CreationOptional<Date>;
}

export function initRoomState(sequelize: Sequelize): typeof RoomStateRow {
  RoomStateRow.init(
    {
      roomId: { type: DataTypes.STRING(40), primaryKey: true },
      revision: { type: DataTypes.INTEGER, primaryKey: true },
      state: { type: DataTypes.JSON, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'room_states', updatedAt: false },
  );
  return RoomStateRow;
}
