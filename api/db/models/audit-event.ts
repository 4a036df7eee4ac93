import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: string;
  declare action: string;
  declare actorUserId: string | null;
  declare actorKeyId: string | null;
  declare targetType: string | null;
  declare targetId: string | null;
  /** JSON text; never holds secrets or passwords. */
  declare details: string | null;
  declare ipAddress: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditEvent(sequelize: Sequelize): typeof AuditEvent {
  AuditEvent.init(
    {
      id: { type: DataTypes.STRING(40), primaryKey: true },
      action: { type: DataTypes.STRING(64), allowNull: false },
      actorUserId: { type: DataTypes.STRING(40), allowNull: true },
      actorKeyId: { type: DataTypes.STRING(40), allowNull: true },
      targetType: { type: DataTypes.STRING(32), allowNull: true },
      targetId: { type: DataTypes.STRING(64), allowNull: true },
      details: { type: DataTypes.TEXT, allowNull: true },
      ipAddress: { type: DataTypes.STRING(64), allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'audit_events', updatedAt: false },
  );
  return AuditEvent;
}
