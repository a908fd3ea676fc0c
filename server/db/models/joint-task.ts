import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { FittingKind } from '@shared/schemas/joint-tasks';

/** One joint to make, numbered J1, J2 … within its order. */
export class JointTask extends Model<InferAttributes<JointTask>, InferCreationAttributes<JointTask>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare number: number;
  declare lineId: string;
  declare fittingKind: FittingKind;
  /** The line's size. */
  declare nominalSize: string;
  declare nominalSizeIn: number;
  /** A tee's branch or a bushing's smaller end: the joint is made at this size. */
  declare reducingSize: string | null;
  declare reducingSizeIn: number | null;
  declare fitterId: CreationOptional<string | null>;
  /** Set on a redo: the task it replaces (a joint cut out). */
  declare replacesTaskId: CreationOptional<string | null>;
  /** Set when the joint went wrong and was cut out: why, when, by whom (a new task replaces it). */
  declare redoReason: CreationOptional<string | null>;
  declare redoneAt: CreationOptional<Date | null>;
  declare redoneById: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

JointTask.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    number: { type: DataTypes.INTEGER, allowNull: false },
    lineId: { type: DataTypes.UUID, allowNull: false },
    fittingKind: { type: DataTypes.TEXT, allowNull: false },
    nominalSize: { type: DataTypes.TEXT, allowNull: false },
    nominalSizeIn: { type: DataTypes.REAL, allowNull: false },
    reducingSize: { type: DataTypes.TEXT },
    reducingSizeIn: { type: DataTypes.REAL },
    fitterId: { type: DataTypes.UUID },
    replacesTaskId: { type: DataTypes.UUID },
    redoReason: { type: DataTypes.TEXT },
    redoneAt: { type: DataTypes.DATE },
    redoneById: { type: DataTypes.UUID },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'joint_tasks' },
);
