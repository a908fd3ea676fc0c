import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { LineStatus, PipeMaterial } from '@shared/schemas/lines';

export class Line extends Model<InferAttributes<Line>, InferCreationAttributes<Line>> {
  declare id: CreationOptional<string>;
  declare lineNumber: string;
  declare area: string;
  declare service: string;
  declare material: PipeMaterial;
  declare schedule: string | null;
  declare sdr: number | null;
  declare nominalSize: string;
  declare nominalSizeIn: number;
  declare designPressurePsi: number;
  declare designTemperatureF: number;
  declare drawingRef: string | null;
  declare notes: string | null;
  declare status: CreationOptional<LineStatus>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Line.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    lineNumber: { type: DataTypes.TEXT, allowNull: false, unique: true },
    area: { type: DataTypes.TEXT, allowNull: false },
    service: { type: DataTypes.TEXT, allowNull: false },
    material: { type: DataTypes.TEXT, allowNull: false },
    schedule: { type: DataTypes.TEXT },
    sdr: { type: DataTypes.REAL },
    nominalSize: { type: DataTypes.TEXT, allowNull: false },
    nominalSizeIn: { type: DataTypes.REAL, allowNull: false },
    designPressurePsi: { type: DataTypes.REAL, allowNull: false },
    designTemperatureF: { type: DataTypes.REAL, allowNull: false },
    drawingRef: { type: DataTypes.TEXT },
    notes: { type: DataTypes.TEXT },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'in-service' },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'lines' },
);
