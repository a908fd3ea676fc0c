import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { AbsentRemoval } from '@shared/schemas/lockout';

/** An order's group lock box (1910.147(f)(3)); the keys of its points sit in it. */
export class LockBox extends Model<InferAttributes<LockBox>, InferCreationAttributes<LockBox>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare label: string;
  /** The authorized person with primary responsibility for the box. */
  declare responsiblePersonId: string;
  declare createdAt: CreationOptional<Date>;
}

LockBox.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    label: { type: DataTypes.TEXT, allowNull: false },
    responsiblePersonId: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'lock_boxes', updatedAt: false },
);

/** One person's lock on one point of the plan or on the box. Removal is recorded, never deleted. */
export class Lock extends Model<InferAttributes<Lock>, InferCreationAttributes<Lock>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare personId: string;
  declare lockNumber: string;
  declare isolationPlanEntryId: string | null;
  declare lockBoxId: string | null;
  declare appliedAt: Date;
  declare handedOverFromLockId: CreationOptional<string | null>;
  declare removedAt: CreationOptional<Date | null>;
  declare removedById: CreationOptional<string | null>;
  declare removal: CreationOptional<'owner' | 'absent' | null>;
  declare absentRecord: CreationOptional<AbsentRemoval | null>;
}

Lock.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    personId: { type: DataTypes.UUID, allowNull: false },
    lockNumber: { type: DataTypes.TEXT, allowNull: false },
    isolationPlanEntryId: { type: DataTypes.UUID },
    lockBoxId: { type: DataTypes.UUID },
    appliedAt: { type: DataTypes.DATE, allowNull: false },
    handedOverFromLockId: { type: DataTypes.UUID },
    removedAt: { type: DataTypes.DATE },
    removedById: { type: DataTypes.UUID },
    removal: { type: DataTypes.TEXT },
    absentRecord: { type: DataTypes.JSONB },
  },
  { sequelize, tableName: 'locks', timestamps: false },
);

export interface VerifiedPoint {
  entryId: string;
  tag: string;
  positionFound: string;
}

/** Zero energy verified for the section ((d)(6)). Superseded when the protection lapses. */
export class IsolationVerification extends Model<InferAttributes<IsolationVerification>, InferCreationAttributes<IsolationVerification>> {
  declare id: CreationOptional<string>;
  declare workOrderId: string;
  declare verifiedById: string;
  declare verifiedAt: Date;
  declare method: string;
  declare reading: string;
  declare points: VerifiedPoint[];
  declare supersededAt: CreationOptional<Date | null>;
}

IsolationVerification.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workOrderId: { type: DataTypes.UUID, allowNull: false },
    verifiedById: { type: DataTypes.UUID, allowNull: false },
    verifiedAt: { type: DataTypes.DATE, allowNull: false },
    method: { type: DataTypes.TEXT, allowNull: false },
    reading: { type: DataTypes.TEXT, allowNull: false },
    points: { type: DataTypes.JSONB, allowNull: false },
    supersededAt: { type: DataTypes.DATE },
  },
  { sequelize, tableName: 'isolation_verifications', timestamps: false },
);
