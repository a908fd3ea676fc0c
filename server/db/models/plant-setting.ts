import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { TestCap, WindowPlanSettings } from '@shared/schemas/plant-settings';

/** The plant's one settings row (id 1): which published cure schedule and which test cap it uses. */
export class PlantSetting extends Model<InferAttributes<PlantSetting>, InferCreationAttributes<PlantSetting>> {
  declare id: CreationOptional<number>;
  declare cureScheduleId: CreationOptional<string>;
  declare testCap: CreationOptional<TestCap>;
  declare updatedById: string | null;
  /** The window-plan minutes an administrator set; keys left out are the defaults. */
  declare windowPlan: CreationOptional<Partial<WindowPlanSettings>>;
  /** IANA name; null is the default (DEFAULT_TIME_ZONE). */
  declare timeZone: CreationOptional<string | null>;
  /** Minutes a lock may stay on after the order's cure holds have all ended before a supervisor is told; null is the default. */
  declare lockLeftOnMinutes: CreationOptional<number | null>;
  /** Raised by every save; a save from an older version is refused (two admins at once). */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

PlantSetting.init(
  {
    id: { type: DataTypes.SMALLINT, primaryKey: true, defaultValue: 1 },
    cureScheduleId: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'A' },
    testCap: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'rating' },
    updatedById: { type: DataTypes.UUID },
    windowPlan: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    timeZone: { type: DataTypes.TEXT },
    lockLeftOnMinutes: { type: DataTypes.INTEGER },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'plant_settings' },
);
