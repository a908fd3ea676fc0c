import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { Person } from '@server/db/models/person';
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
  declare cancelledAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  /** Who uploaded the file (include 'uploader'). */
  declare uploader?: NonAttribute<Person>;
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
    cancelledAt: { type: DataTypes.DATE },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'line_imports', defaultScope: { attributes: { exclude: ['source'] } } },
);

LineImport.belongsTo(Person, { as: 'uploader', foreignKey: 'createdById' });

/** One row of an import's preview, known by its import and the file's row number. */
export class LineImportRow extends Model<InferAttributes<LineImportRow>, InferCreationAttributes<LineImportRow>> {
  declare importId: string;
  declare rowNumber: number;
  declare outcome: RowOutcome;
  declare key: string | null;
  declare data: Record<string, unknown> | null;
  declare changes: Record<string, { from: unknown; to: unknown }> | null;
  declare problems: { column: string; message: string }[] | null;
  // A lines preview's new or changed line, as `lines` will have it (null otherwise).
  declare area: CreationOptional<string | null>;
  declare service: CreationOptional<string | null>;
  declare material: CreationOptional<string | null>;
  declare schedule: CreationOptional<string | null>;
  declare sdr: CreationOptional<number | null>;
  declare nominalSize: CreationOptional<string | null>;
  declare nominalSizeIn: CreationOptional<number | null>;
  declare designPressurePsi: CreationOptional<number | null>;
  declare designTemperatureF: CreationOptional<number | null>;
  declare drawingRef: CreationOptional<string | null>;
  declare notes: CreationOptional<string | null>;
}

LineImportRow.init(
  {
    importId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
    rowNumber: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    outcome: { type: DataTypes.TEXT, allowNull: false },
    key: { type: DataTypes.TEXT },
    data: { type: DataTypes.JSONB },
    changes: { type: DataTypes.JSONB },
    problems: { type: DataTypes.JSONB },
    area: { type: DataTypes.TEXT },
    service: { type: DataTypes.TEXT },
    material: { type: DataTypes.TEXT },
    schedule: { type: DataTypes.TEXT },
    sdr: { type: DataTypes.REAL },
    nominalSize: { type: DataTypes.TEXT },
    nominalSizeIn: { type: DataTypes.REAL },
    designPressurePsi: { type: DataTypes.REAL },
    designTemperatureF: { type: DataTypes.REAL },
    drawingRef: { type: DataTypes.TEXT },
    notes: { type: DataTypes.TEXT },
  },
  { sequelize, tableName: 'line_import_rows', timestamps: false },
);
