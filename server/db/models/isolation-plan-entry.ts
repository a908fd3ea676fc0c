import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { PlanPointKind } from '@shared/schemas/isolation-plans';

/** One point of an order's isolation plan: a register point, or a drain or vent point (no register id). */
export class IsolationPlanEntry extends Model<InferAttributes<IsolationPlanEntry>, InferCreationAttributes<IsolationPlanEntry>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare isolationPointId: string | null;
  declare lineId: string;
  declare tag: string;
  declare kind: PlanPointKind;
  declare requiredPosition: string;
  declare sortOrder: number;
  /** Its key sits in the order's group lock box; null: locked point by point. */
  declare lockBoxId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

IsolationPlanEntry.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    isolationPointId: { type: DataTypes.UUID },
    lineId: { type: DataTypes.UUID, allowNull: false },
    tag: { type: DataTypes.TEXT, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    requiredPosition: { type: DataTypes.TEXT, allowNull: false },
    sortOrder: { type: DataTypes.INTEGER, allowNull: false },
    lockBoxId: { type: DataTypes.UUID },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'isolation_plan_entries', updatedAt: false },
);
