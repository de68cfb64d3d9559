import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

import type { AlertKind } from '@/lib/alerts/content';

export type { AlertKind };

/**
 * An alert shown to one user in the app (and usually sent by e-mail). Each subject (a departure's
 * warning, a reminder, one night's notice) has numbered revisions: a material change of the
 * prediction writes a new revision and supersedes the previous one. `state` holds what "material"
 * is measured against; `data` what the alert shows, in SI units and ISO instants (rendered per viewer).
 */
export class Alert extends Model<InferAttributes<Alert>, InferCreationAttributes<Alert>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare userId: number;
  declare kind: AlertKind;
  declare subjectKey: string;
  declare revision: number;
  declare departureId: CreationOptional<number | null>;
  declare airfieldId: CreationOptional<number | null>;
  declare title: string;
  declare data: unknown;
  declare state: unknown;
  /** The page the alert is about (path only). */
  declare link: string;
  declare acknowledgedAt: CreationOptional<Date | null>;
  /** The condition went away (the departure is now on track, or was cancelled). */
  declare resolvedAt: CreationOptional<Date | null>;
  /** A later revision replaced this one. */
  declare supersededAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAlert(sequelize: Sequelize) {
  Alert.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(24), allowNull: false },
      subjectKey: { type: DataTypes.STRING(160), allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      departureId: { type: DataTypes.INTEGER, allowNull: true },
      airfieldId: { type: DataTypes.INTEGER, allowNull: true },
      title: { type: DataTypes.STRING(200), allowNull: false },
      data: { type: DataTypes.JSON, allowNull: false },
      state: { type: DataTypes.JSON, allowNull: false },
      link: { type: DataTypes.STRING(300), allowNull: false },
      acknowledgedAt: { type: DataTypes.DATE, allowNull: true },
      resolvedAt: { type: DataTypes.DATE, allowNull: true },
      supersededAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'alerts' },
  );
}
