import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';

/** A hydrostatic test as its witness recorded it (ASME B31.3 345.2.7). */
export class PressureTest extends Model<InferAttributes<PressureTest>, InferCreationAttributes<PressureTest>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare result: 'passed' | 'failed';
  declare medium: string;
  declare testPressurePsi: number;
  declare gauge: string;
  declare startedAt: Date;
  declare startReadingPsi: number;
  declare endedAt: Date;
  declare endReadingPsi: number;
  declare leakingJointIds: CreationOptional<string[]>;
  declare pipingIdentified: string;
  declare examiner: string;
  declare notes: string | null;
  declare witnessId: string;
  declare recordedAt: Date;
}

PressureTest.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    result: { type: DataTypes.TEXT, allowNull: false },
    medium: { type: DataTypes.TEXT, allowNull: false },
    testPressurePsi: { type: DataTypes.REAL, allowNull: false },
    gauge: { type: DataTypes.TEXT, allowNull: false },
    startedAt: { type: DataTypes.DATE, allowNull: false },
    startReadingPsi: { type: DataTypes.REAL, allowNull: false },
    endedAt: { type: DataTypes.DATE, allowNull: false },
    endReadingPsi: { type: DataTypes.REAL, allowNull: false },
    leakingJointIds: { type: DataTypes.ARRAY(DataTypes.UUID), allowNull: false, defaultValue: [] },
    pipingIdentified: { type: DataTypes.TEXT, allowNull: false },
    examiner: { type: DataTypes.TEXT, allowNull: false },
    notes: { type: DataTypes.TEXT },
    witnessId: { type: DataTypes.UUID, allowNull: false },
    recordedAt: { type: DataTypes.DATE, allowNull: false },
  },
  { sequelize, tableName: 'pressure_tests', timestamps: false },
);

/** Operations' release of an order's lines back to service, with the checklist signed. */
export class Release extends Model<InferAttributes<Release>, InferCreationAttributes<Release>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare releasedById: string;
  declare releasedAt: Date;
  declare checklist: Record<string, boolean>;
  declare notes: string | null;
}

Release.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    releasedById: { type: DataTypes.UUID, allowNull: false },
    releasedAt: { type: DataTypes.DATE, allowNull: false },
    checklist: { type: DataTypes.JSONB, allowNull: false },
    notes: { type: DataTypes.TEXT },
  },
  { sequelize, tableName: 'releases', timestamps: false },
);
