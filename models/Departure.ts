import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Aircraft } from './Aircraft';
import type { Organization } from './Organization';
import type { User } from './User';

/** The first flight of a day for an aircraft, with the oil temperature it must have. */
export class Departure extends Model<InferAttributes<Departure>, InferCreationAttributes<Departure>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare pilotId: ForeignKey<User['id']>;
  declare bookedById: ForeignKey<User['id']>;
  declare departAt: Date;
  declare readyC: number;
  declare floorC: CreationOptional<number | null>;
  /** Start window: ready from departAt through this many minutes; the heater stays on through it. */
  declare holdMinutes: CreationOptional<number>;
  /** The ready temperature was lowered to the aircraft's figure: by whom and when (null: never). */
  declare readyLoweredById: CreationOptional<number | null>;
  declare readyLoweredAt: CreationOptional<Date | null>;
  declare notes: CreationOptional<string>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initDeparture(sequelize: Sequelize) {
  Departure.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      pilotId: { type: DataTypes.INTEGER, allowNull: false },
      bookedById: { type: DataTypes.INTEGER, allowNull: false },
      departAt: { type: DataTypes.DATE, allowNull: false },
      readyC: { type: DataTypes.FLOAT, allowNull: false },
      floorC: { type: DataTypes.FLOAT, allowNull: true },
      holdMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
      readyLoweredById: { type: DataTypes.INTEGER, allowNull: true },
      readyLoweredAt: { type: DataTypes.DATE, allowNull: true },
      notes: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      cancelledAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Departure', tableName: 'departures' },
  );
}
