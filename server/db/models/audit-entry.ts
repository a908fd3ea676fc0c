import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';

/** Append-only: the migration revokes UPDATE and DELETE through a trigger. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<string>;
  declare at: CreationOptional<Date>;
  declare actorId: string | null;
  declare action: string;
  declare entity: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
}

AuditEntry.init(
  {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    actorId: { type: DataTypes.UUID },
    action: { type: DataTypes.TEXT, allowNull: false },
    entity: { type: DataTypes.TEXT, allowNull: false },
    entityId: { type: DataTypes.TEXT },
    before: { type: DataTypes.JSONB },
    after: { type: DataTypes.JSONB },
  },
  { sequelize, tableName: 'audit_entries', timestamps: false },
);
