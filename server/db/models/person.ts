import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { Role } from '@shared/schemas/roles';

export class Person extends Model<InferAttributes<Person>, InferCreationAttributes<Person>> {
  declare id: CreationOptional<string>;
  declare subject: string;
  declare issuer: string;
  declare name: string;
  declare email: string | null;
  declare rolesFromIdp: CreationOptional<Role[]>;
  declare rolesGranted: CreationOptional<Role[]>;
  declare rolesWithdrawn: CreationOptional<Role[]>;
  declare lastSignInAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Person.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    subject: { type: DataTypes.TEXT, allowNull: false },
    issuer: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    email: { type: DataTypes.TEXT },
    rolesFromIdp: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [], field: 'roles_from_idp' },
    rolesGranted: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    rolesWithdrawn: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    lastSignInAt: { type: DataTypes.DATE },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'people' },
);
