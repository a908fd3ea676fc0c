import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { Priority, WorkOrderKind, WorkOrderState } from '@shared/schemas/work-orders';

/** One work order. Its state changes only through server/services/work-orders/states.ts. */
export class WorkOrder extends Model<InferAttributes<WorkOrder>, InferCreationAttributes<WorkOrder>> {
  declare id: CreationOptional<string>;
  /** "WO-2026-0042": from the per-year counter, in the create transaction. */
  declare number: string;
  declare kind: WorkOrderKind;
  declare priority: Priority;
  declare scope: string;
  declare requestedBy: string;
  declare windowStart: Date | null;
  declare windowEnd: Date | null;
  declare forecastLowF: number | null;
  declare forecastHighRh: number | null;
  /** The planner's raised test pressure; null: the engine's minimum. */
  declare testPressurePsi: number | null;
  declare componentRatingPsi: number | null;
  declare state: CreationOptional<WorkOrderState>;
  declare lateReason: CreationOptional<string | null>;
  declare cancelReason: CreationOptional<string | null>;
  declare plannedAt: CreationOptional<Date | null>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare releasedAt: CreationOptional<Date | null>;
  /** The last joint task number given out (J1, J2 …); numbers are never reused. */
  declare lastJointNumber: CreationOptional<number>;
  declare createdById: string;
  /** Raised by every change; an edit made from an older version is refused. */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

WorkOrder.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    number: { type: DataTypes.TEXT, allowNull: false, unique: true },
    kind: { type: DataTypes.TEXT, allowNull: false },
    priority: { type: DataTypes.TEXT, allowNull: false },
    scope: { type: DataTypes.TEXT, allowNull: false },
    requestedBy: { type: DataTypes.TEXT, allowNull: false },
    windowStart: { type: DataTypes.DATE },
    windowEnd: { type: DataTypes.DATE },
    forecastLowF: { type: DataTypes.REAL },
    forecastHighRh: { type: DataTypes.REAL },
    testPressurePsi: { type: DataTypes.REAL },
    componentRatingPsi: { type: DataTypes.REAL },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    lateReason: { type: DataTypes.TEXT },
    cancelReason: { type: DataTypes.TEXT },
    plannedAt: { type: DataTypes.DATE },
    cancelledAt: { type: DataTypes.DATE },
    releasedAt: { type: DataTypes.DATE },
    lastJointNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: { type: DataTypes.UUID, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'work_orders' },
);

/** Which register lines an order works on. */
export class WorkOrderLine extends Model<InferAttributes<WorkOrderLine>, InferCreationAttributes<WorkOrderLine>> {
  declare workOrderId: string;
  declare lineId: string;
}

WorkOrderLine.init(
  {
    workOrderId: { type: DataTypes.UUID, primaryKey: true },
    lineId: { type: DataTypes.UUID, primaryKey: true },
  },
  { sequelize, tableName: 'work_order_lines', timestamps: false },
);
