import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';

export class Airfield extends Model<InferAttributes<Airfield>, InferCreationAttributes<Airfield>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare name: string;
  /** The organization's own short identifier for the field (invented in the demo). */
  declare ident: string;
  declare latitude: number;
  declare longitude: number;
  declare elevationM: number;
  /** IANA time zone, e.g. Europe/Helsinki. */
  declare timeZone: string;
  declare archivedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAirfield(sequelize: Sequelize) {
  Airfield.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      ident: { type: DataTypes.STRING(8), allowNull: false },
      latitude: { type: DataTypes.FLOAT, allowNull: false },
      longitude: { type: DataTypes.FLOAT, allowNull: false },
      elevationM: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      timeZone: { type: DataTypes.STRING(64), allowNull: false },
      archivedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Airfield', tableName: 'airfields' },
  );
}
