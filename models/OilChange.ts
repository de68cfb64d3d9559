import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Aircraft } from './Aircraft';
import type { User } from './User';

/** An oil change: when, at what engine hours, which oil. Quantities in litres. */
export class OilChange extends Model<InferAttributes<OilChange>, InferCreationAttributes<OilChange>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare userId: ForeignKey<User['id']> | null;
  declare changedAt: Date;
  declare engineHours: number;
  declare oilGrade: string;
  declare quantityL: CreationOptional<number | null>;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOilChange(sequelize: Sequelize) {
  OilChange.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      changedAt: { type: DataTypes.DATE, allowNull: false },
      engineHours: { type: DataTypes.FLOAT, allowNull: false },
      oilGrade: { type: DataTypes.STRING(40), allowNull: false },
      quantityL: { type: DataTypes.FLOAT, allowNull: true },
      notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'OilChange', tableName: 'oil_changes' },
  );
}
