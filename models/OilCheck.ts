import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Aircraft } from './Aircraft';
import type { User } from './User';

/** A cold oil check. Stored in SI (litres, °C) whatever unit the person entered it in. */
export class OilCheck extends Model<InferAttributes<OilCheck>, InferCreationAttributes<OilCheck>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare userId: ForeignKey<User['id']> | null;
  declare checkedAt: Date;
  /** Dipstick level as read, litres. */
  declare levelL: number;
  declare oilTempC: number;
  declare outsideTempC: number;
  /** Blade turns until the oil returned (dry-sump engines); null when not turned through. */
  declare bladesTurned: CreationOptional<number | null>;
  declare engineHours: CreationOptional<number | null>;
  /** Oil added after the reading, litres. */
  declare addedL: CreationOptional<number>;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOilCheck(sequelize: Sequelize) {
  OilCheck.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      checkedAt: { type: DataTypes.DATE, allowNull: false },
      levelL: { type: DataTypes.FLOAT, allowNull: false },
      oilTempC: { type: DataTypes.FLOAT, allowNull: false },
      outsideTempC: { type: DataTypes.FLOAT, allowNull: false },
      bladesTurned: { type: DataTypes.INTEGER, allowNull: true },
      engineHours: { type: DataTypes.FLOAT, allowNull: true },
      addedL: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'OilCheck', tableName: 'oil_checks' },
  );
}
