import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Aircraft } from './Aircraft';
import type { User } from './User';

import type { TempLogLayout } from '@/lib/views/logs';

export type { TempLogLayout };

/**
 * An uploaded temperature-logger series for one aircraft. The points are stored compactly in
 * `points`: a deflated packed buffer (lib/fit/pack.ts) of epoch-ms times and °C values, so a
 * 200,000-row file is one row of a few megabytes at most rather than 200,000 rows.
 */
export class TempLog extends Model<InferAttributes<TempLog>, InferCreationAttributes<TempLog>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare uploadedById: ForeignKey<User['id']> | null;
  declare fileName: string;
  declare sizeBytes: number;
  declare rowCount: number;
  declare startAt: Date;
  declare endAt: Date;
  declare hasAmbient: boolean;
  declare layout: TempLogLayout;
  /** Notes from parsing that did not stop the upload (skipped blank rows …). */
  declare warnings: CreationOptional<string[]>;
  declare points: Buffer;
  /** The chosen cool-down window (null until fitted). */
  declare windowStartAt: CreationOptional<Date | null>;
  declare windowEndAt: CreationOptional<Date | null>;
  /** Whether the engine cover was on while the log was taken (the fit's losses are then scaled back). */
  declare coverOn: CreationOptional<boolean>;
  /** The last fit's result (lib/fit FitReport), null until fitted. */
  declare fit: CreationOptional<object | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initTempLog(sequelize: Sequelize) {
  TempLog.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      uploadedById: { type: DataTypes.INTEGER, allowNull: true },
      fileName: { type: DataTypes.STRING(200), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      rowCount: { type: DataTypes.INTEGER, allowNull: false },
      startAt: { type: DataTypes.DATE, allowNull: false },
      endAt: { type: DataTypes.DATE, allowNull: false },
      hasAmbient: { type: DataTypes.BOOLEAN, allowNull: false },
      layout: { type: DataTypes.JSON, allowNull: false },
      warnings: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
      points: { type: DataTypes.BLOB, allowNull: false },
      windowStartAt: { type: DataTypes.DATE, allowNull: true },
      windowEndAt: { type: DataTypes.DATE, allowNull: true },
      coverOn: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      fit: { type: DataTypes.JSON, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'TempLog', tableName: 'temp_logs' },
  );
}
