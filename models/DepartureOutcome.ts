import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Departure } from './Departure';
import type { Aircraft } from './Aircraft';
import type { User } from './User';

/**
 * A Morning outcome: whether the departure flew and the oil temperature shown at start (°C), with a
 * snapshot of the stored Heat plan's prediction at the time it was recorded.
 */
export class DepartureOutcome extends Model<InferAttributes<DepartureOutcome>, InferCreationAttributes<DepartureOutcome>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare departureId: ForeignKey<Departure['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare flown: boolean;
  /** Oil temperature shown at start, °C; null when not flown. */
  declare oilAtStartC: number | null;
  declare recordedById: ForeignKey<User['id']> | null;
  declare recordedAt: Date;
  /** Snapshot of the plan: predicted oil at departure (°C), stated chance of being ready (0–1). */
  declare predictedOilC: number | null;
  declare probabilityReady: number | null;
  /** The departure's ready temperature when recorded (°C). */
  declare readyC: number;
  /** Energy the plan used, and the usual rule's (heater on all night) for comparison, kWh. */
  declare energyKWh: number | null;
  declare usualEnergyKWh: number | null;
  declare planStatus: string | null;
  /** Where the aircraft's thermal parameters came from ('preset', 'fitted', 'manual'). */
  declare thermalSource: string | null;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initDepartureOutcome(sequelize: Sequelize) {
  DepartureOutcome.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      departureId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      flown: { type: DataTypes.BOOLEAN, allowNull: false },
      oilAtStartC: { type: DataTypes.FLOAT, allowNull: true },
      recordedById: { type: DataTypes.INTEGER, allowNull: true },
      recordedAt: { type: DataTypes.DATE, allowNull: false },
      predictedOilC: { type: DataTypes.FLOAT, allowNull: true },
      probabilityReady: { type: DataTypes.FLOAT, allowNull: true },
      readyC: { type: DataTypes.FLOAT, allowNull: false },
      energyKWh: { type: DataTypes.FLOAT, allowNull: true },
      usualEnergyKWh: { type: DataTypes.FLOAT, allowNull: true },
      planStatus: { type: DataTypes.STRING(12), allowNull: true },
      thermalSource: { type: DataTypes.STRING(12), allowNull: true },
      notes: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'DepartureOutcome', tableName: 'departure_outcomes' },
  );
}
