import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { HOLD_KINDS, HOLD_STATUSES, JointStep, PhotoStep } from '@shared/schemas/joint-steps';

/** One recorded step of a joint: its values, who and when. One per step and joint. */
export class JointStepRecord extends Model<InferAttributes<JointStepRecord>, InferCreationAttributes<JointStepRecord>> {
  declare id: CreationOptional<string>;
  declare jointTaskId: string;
  declare step: JointStep;
  declare values: Record<string, unknown>;
  declare recordedById: string;
  declare recordedAt: Date;
}

JointStepRecord.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    jointTaskId: { type: DataTypes.UUID, allowNull: false },
    step: { type: DataTypes.TEXT, allowNull: false },
    values: { type: DataTypes.JSONB, allowNull: false },
    recordedById: { type: DataTypes.UUID, allowNull: false },
    recordedAt: { type: DataTypes.DATE, allowNull: false },
  },
  { sequelize, tableName: 'joint_steps', timestamps: false },
);

/** A dry fit the server refused (outside 1/3–2/3 of the socket depth): the fitter re-cuts or takes another fitting. */
export class DryFitRetry extends Model<InferAttributes<DryFitRetry>, InferCreationAttributes<DryFitRetry>> {
  declare id: CreationOptional<string>;
  declare jointTaskId: string;
  declare insertionIn: number;
  declare message: string;
  declare recordedById: string;
  declare recordedAt: Date;
}

DryFitRetry.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    jointTaskId: { type: DataTypes.UUID, allowNull: false },
    insertionIn: { type: DataTypes.REAL, allowNull: false },
    message: { type: DataTypes.TEXT, allowNull: false },
    recordedById: { type: DataTypes.UUID, allowNull: false },
    recordedAt: { type: DataTypes.DATE, allowNull: false },
  },
  { sequelize, tableName: 'dry_fit_retries', timestamps: false },
);

/** A set or cure hold on a joint: no handling, then no pressure, until it ends. */
export class Hold extends Model<InferAttributes<Hold>, InferCreationAttributes<Hold>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare jointTaskId: string | null;
  declare kind: (typeof HOLD_KINDS)[number];
  declare status: (typeof HOLD_STATUSES)[number];
  declare startsAt: Date;
  /** Null while awaiting a supervisor's engineering cure time. */
  declare endsAt: Date | null;
  declare temperatureF: number;
  declare relativeHumidity: number;
  declare pressurePsi: number;
  declare schedule: string | null;
  declare basis: string;
  declare source: string | null;
  declare endedAt: CreationOptional<Date | null>;
  declare endedBy: CreationOptional<string | null>;
  declare voidReason: CreationOptional<string | null>;
  /** A supervisor's engineering cure time, where the engine refused: who, why, how long. */
  declare engineeringById: CreationOptional<string | null>;
  declare engineeringReason: CreationOptional<string | null>;
  declare engineeringMinutes: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
}

Hold.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    jointTaskId: { type: DataTypes.UUID },
    kind: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false },
    startsAt: { type: DataTypes.DATE, allowNull: false },
    endsAt: { type: DataTypes.DATE },
    temperatureF: { type: DataTypes.REAL, allowNull: false },
    relativeHumidity: { type: DataTypes.REAL, allowNull: false },
    pressurePsi: { type: DataTypes.REAL, allowNull: false },
    schedule: { type: DataTypes.TEXT },
    basis: { type: DataTypes.TEXT, allowNull: false },
    source: { type: DataTypes.TEXT },
    endedAt: { type: DataTypes.DATE },
    endedBy: { type: DataTypes.TEXT },
    voidReason: { type: DataTypes.TEXT },
    engineeringById: { type: DataTypes.UUID },
    engineeringReason: { type: DataTypes.TEXT },
    engineeringMinutes: { type: DataTypes.INTEGER },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'holds', updatedAt: false },
);

/** A joint photo, re-encoded without metadata. `content` is read only when the photo is served. */
export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
  declare id: CreationOptional<string>;
  declare jointTaskId: string;
  declare step: PhotoStep;
  declare content: Buffer;
  declare mediaType: string;
  declare width: number;
  declare height: number;
  declare bytes: number;
  declare takenById: string;
  declare createdAt: CreationOptional<Date>;
}

Photo.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    jointTaskId: { type: DataTypes.UUID, allowNull: false },
    step: { type: DataTypes.TEXT, allowNull: false },
    content: { type: DataTypes.BLOB, allowNull: false },
    mediaType: { type: DataTypes.TEXT, allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    takenById: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'photos', updatedAt: false },
);

/** A tablet write's key and its first answer (see server/middleware/idempotency.ts). */
export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  declare personId: string;
  declare key: string;
  declare method: string;
  declare path: string;
  declare requestHash: string;
  declare status: number | null;
  declare body: unknown;
  declare createdAt: CreationOptional<Date>;
}

IdempotencyKey.init(
  {
    personId: { type: DataTypes.UUID, primaryKey: true },
    key: { type: DataTypes.TEXT, primaryKey: true },
    method: { type: DataTypes.TEXT, allowNull: false },
    path: { type: DataTypes.TEXT, allowNull: false },
    requestHash: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.INTEGER },
    body: { type: DataTypes.JSONB },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'idempotency_keys', updatedAt: false },
);

/** A data logger's temperature record for an order's cure, as read; applied, it only lengthens holds. */
export class TemperatureLog extends Model<InferAttributes<TemperatureLog>, InferCreationAttributes<TemperatureLog>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare fileName: string;
  declare uploadedById: string;
  declare uploadedAt: Date;
  declare unit: 'F' | 'C' | null;
  declare readings: { at: string; temperatureF: number; relativeHumidity?: number }[];
  declare problems: string[];
  declare status: 'previewed' | 'applied';
  declare appliedById: CreationOptional<string | null>;
  declare appliedAt: CreationOptional<Date | null>;
}

TemperatureLog.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    fileName: { type: DataTypes.TEXT, allowNull: false },
    uploadedById: { type: DataTypes.UUID, allowNull: false },
    uploadedAt: { type: DataTypes.DATE, allowNull: false },
    unit: { type: DataTypes.TEXT },
    readings: { type: DataTypes.JSONB, allowNull: false },
    problems: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false },
    appliedById: { type: DataTypes.UUID },
    appliedAt: { type: DataTypes.DATE },
  },
  { sequelize, tableName: 'temperature_logs', timestamps: false },
);
