import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Airfield } from './Airfield';
import type { Organization } from './Organization';

/**
 * A time-of-use electricity tariff for an airfield: named periods with a price each, and which period
 * applies in each hour, as 12×24 month-by-hour matrices for weekdays and weekends (the structure of the
 * OpenEI Utility Rate Database). A flat tariff has one period.
 */
export interface TariffPeriod {
  name: string;
  pricePerKWh: number;
}
export class Tariff extends Model<InferAttributes<Tariff>, InferCreationAttributes<Tariff>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare airfieldId: ForeignKey<Airfield['id']>;
  declare currency: string;
  declare periods: TariffPeriod[];
  /** weekdaySchedule[month 0..11][hour 0..23] = period index. */
  declare weekdaySchedule: number[][];
  declare weekendSchedule: number[][];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initTariff(sequelize: Sequelize) {
  Tariff.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      airfieldId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      periods: { type: DataTypes.JSON, allowNull: false },
      weekdaySchedule: { type: DataTypes.JSON, allowNull: false },
      weekendSchedule: { type: DataTypes.JSON, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Tariff', tableName: 'tariffs' },
  );
}
