import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Organization extends Model<InferAttributes<Organization>, InferCreationAttributes<Organization>> {
  declare id: CreationOptional<number>;
  declare name: string;
  /** Forecast low below which managers get the cold-night notice (°C). */
  declare coldNightThresholdC: CreationOptional<number>;
  /** Local time (HH:MM, each airfield's own zone) at which the cold-night notice goes out. */
  declare coldNightNoticeAt: CreationOptional<string>;
  /** The start window new departures get, minutes (the heater stays on this long past departure). */
  declare holdMinutes: CreationOptional<number>;
  /** Plans aim to be ready with this chance (0.5–0.99), counting every error source (lib/planner/chance.ts). */
  declare targetChance: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOrganization(sequelize: Sequelize) {
  Organization.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      coldNightThresholdC: { type: DataTypes.FLOAT, allowNull: false, defaultValue: -5 },
      coldNightNoticeAt: { type: DataTypes.STRING(5), allowNull: false, defaultValue: '18:00' },
      holdMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
      targetChance: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0.9 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Organization', tableName: 'organizations' },
  );
}
