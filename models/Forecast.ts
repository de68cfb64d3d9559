import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ForecastHour } from '@/lib/weather/types';
import type { Organization } from './Organization';
import type { Airfield } from './Airfield';

/**
 * The cached hourly forecast of one airfield (one row per airfield). It is replaced on each
 * successful fetch; a failed fetch only records the attempt and its error, so the last good
 * forecast stays in use and pages can say how old it is (a row whose first fetch failed has no
 * hours and no fetchedAt, and still records the failure).
 */
export class Forecast extends Model<InferAttributes<Forecast>, InferCreationAttributes<Forecast>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare airfieldId: ForeignKey<Airfield['id']>;
  declare source: 'fake' | 'remote';
  /** When the stored forecast was fetched (the last success); null while no fetch has succeeded yet. */
  declare fetchedAt: Date | null;
  /** The airfield's coordinates the forecast was asked for (a moved airfield needs a new one). */
  declare latitude: number;
  declare longitude: number;
  /** The grid elevation the service answered with, m. */
  declare elevationM: number;
  /** Hourly values, UTC instants, strictly increasing; empty while no fetch has succeeded yet. */
  declare hours: ForecastHour[];
  /** The last attempt to fetch, successful or not. */
  declare lastAttemptAt: CreationOptional<Date | null>;
  /** Set when the last attempt failed; cleared by the next success. */
  declare lastErrorKind: CreationOptional<string | null>;
  declare lastErrorMessage: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initForecast(sequelize: Sequelize) {
  Forecast.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      airfieldId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      source: { type: DataTypes.STRING(10), allowNull: false },
      fetchedAt: { type: DataTypes.DATE, allowNull: true },
      latitude: { type: DataTypes.FLOAT, allowNull: false },
      longitude: { type: DataTypes.FLOAT, allowNull: false },
      elevationM: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      hours: { type: DataTypes.JSON, allowNull: false },
      lastAttemptAt: { type: DataTypes.DATE, allowNull: true },
      lastErrorKind: { type: DataTypes.STRING(16), allowNull: true },
      lastErrorMessage: { type: DataTypes.STRING(300), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Forecast', tableName: 'forecasts' },
  );
}
