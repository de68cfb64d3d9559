import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Departure } from './Departure';
import type { Organization } from './Organization';

/**
 * The stored Heat plan of a departure. `inputsKey` fingerprints everything it was computed from
 * (forecast fetch, departure, aircraft, heaters, shelter, tariff); a different key means recompute.
 */
export class HeatPlan extends Model<InferAttributes<HeatPlan>, InferCreationAttributes<HeatPlan>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare departureId: ForeignKey<Departure['id']>;
  declare inputsKey: string;
  declare computedAt: Date;
  declare status: string;
  declare switchOnAt: CreationOptional<Date | null>;
  declare oilAtDepartureC: number;
  declare energyKWh: number;
  declare cost: CreationOptional<number | null>;
  declare probabilityReady: CreationOptional<number | null>;
  /** The whole planner result (heater intervals, baselines, fix, curve summary). */
  declare result: unknown;
  declare confirmedById: CreationOptional<number | null>;
  declare confirmedAt: CreationOptional<Date | null>;
  /** The key the confirmation was given for: a recompute with other inputs needs a new confirmation. */
  declare confirmedKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initHeatPlan(sequelize: Sequelize) {
  HeatPlan.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      departureId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      inputsKey: { type: DataTypes.STRING(64), allowNull: false },
      computedAt: { type: DataTypes.DATE, allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false },
      switchOnAt: { type: DataTypes.DATE, allowNull: true },
      oilAtDepartureC: { type: DataTypes.FLOAT, allowNull: false },
      energyKWh: { type: DataTypes.FLOAT, allowNull: false },
      cost: { type: DataTypes.FLOAT, allowNull: true },
      probabilityReady: { type: DataTypes.FLOAT, allowNull: true },
      result: { type: DataTypes.JSON, allowNull: false },
      confirmedById: { type: DataTypes.INTEGER, allowNull: true },
      confirmedAt: { type: DataTypes.DATE, allowNull: true },
      confirmedKey: { type: DataTypes.STRING(64), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'HeatPlan', tableName: 'heat_plans' },
  );
}
