import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { Line } from '@server/db/models/line';
import type { IsolationKind } from '@shared/schemas/lines';

export class IsolationPoint extends Model<InferAttributes<IsolationPoint>, InferCreationAttributes<IsolationPoint>> {
  declare id: CreationOptional<string>;
  declare tag: string;
  declare lineId: string;
  declare kind: IsolationKind;
  declare normalPosition: string;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

IsolationPoint.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    tag: { type: DataTypes.TEXT, allowNull: false, unique: true },
    lineId: { type: DataTypes.UUID, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    normalPosition: { type: DataTypes.TEXT, allowNull: false },
    notes: { type: DataTypes.TEXT },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'isolation_points' },
);

Line.hasMany(IsolationPoint, { foreignKey: 'lineId', as: 'isolationPoints' });
IsolationPoint.belongsTo(Line, { foreignKey: 'lineId', as: 'line' });
