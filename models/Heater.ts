import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Aircraft } from './Aircraft';
import type { Organization } from './Organization';

import type { HeaterControl } from '@/lib/heater-controls';
export { HEATER_CONTROLS, type HeaterControl } from '@/lib/heater-controls';

/** A preheater fitted to an aircraft: its power goes to one node (oil or engine mass). */
export class Heater extends Model<InferAttributes<Heater>, InferCreationAttributes<Heater>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare kind: string;
  declare powerW: number;
  declare node: 'oil' | 'engine';
  /** timer: one block ending at departure; relay: switched per slot; manual: someone switches it on. */
  declare control: HeaterControl;
  /** Granularity of the control, minutes. */
  declare slotMinutes: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initHeater(sequelize: Sequelize) {
  Heater.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(32), allowNull: false },
      powerW: { type: DataTypes.FLOAT, allowNull: false },
      node: { type: DataTypes.STRING(8), allowNull: false },
      control: { type: DataTypes.STRING(8), allowNull: false },
      slotMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Heater', tableName: 'heaters' },
  );
}
