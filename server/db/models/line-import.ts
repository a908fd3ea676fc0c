import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { ImportKind, ImportStatus, ImportCounts, RowOutcome } from '@shared/schemas/line-imports';

/** One uploaded register file: its preview, then (once confirmed) its application. */
export class LineImport extends Model<InferAttributes<LineImport>, InferCreationAttributes<LineImport>> {
  declare id: CreationOptional<string>;
  declare kind: ImportKind;
  declare filename: string;
  declare status: ImportStatus;
  declare source: string;
  declare totalRows: CreationOptional<number>;
  declare counts: CreationOptional<ImportCounts>;
  declare progress: CreationOptional<number>;
  declare error: string | null;
  declare createdById: string;
  declare confirmedById: string | null;
  declare previewedAt: CreationOptional<Date | null>;
  declare appliedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

LineImport.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    kind: { type: DataTypes.TEXT, allowNull: false },
    filename: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false },
    source: { type: DataTypes.TEXT, allowNull: false },
    totalRows: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    counts: { type: DataTypes.JSONB, allowNull: false, defaultValue: { new: 0, changed: 0, unchanged: 0, rejected: 0 } },
    progress: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT },
    createdById: { type: DataTypes.UUID, allowNull: false },
    confirmedById: { type: DataTypes.UUID },
    previewedAt: { type: DataTypes.DATE },
    appliedAt: { type: DataTypes.DATE },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'line_imports', defaultScope: { attributes: { exclude: ['source'] } } },
);

export class LineImportRow extends Model<InferAttributes<LineImportRow>, InferCreationAttributes<LineImportRow>> {
  declare id: CreationOptional<string>;
  declare importId: string;
  declare rowNumber: number;
  declare outcome: RowOutcome;
  declare key: string | null;
  declare data: Record<string, unknown> | null;
  declare changes: Record<string, { from: unknown; to: unknown }> | null;
  declare problems: { column: string; message: string }[] | null;
}

LineImportRow.init(
  {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    importId: { type: DataTypes.UUID, allowNull: false },
    rowNumber: { type: DataTypes.INTEGER, allowNull: false },
    outcome: { type: DataTypes.TEXT, allowNull: false },
    key: { type: DataTypes.TEXT },
    data: { type: DataTypes.JSONB },
    changes: { type: DataTypes.JSONB },
    problems: { type: DataTypes.JSONB },
  },
  { sequelize, tableName: 'line_import_rows', timestamps: false },
);
