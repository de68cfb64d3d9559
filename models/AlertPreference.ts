import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** How one kind of alert reaches the user: in the app and by e-mail, in the app only, or not at all. */
import type { AlertChannel } from '@/lib/views/alerts';

export type { AlertChannel };

/**
 * A user's alert preferences (absent row: the defaults). The oil-too-cold warning is always shown in
 * the app and ignores quiet hours; only its e-mail can be turned off.
 */
export class AlertPreference extends Model<InferAttributes<AlertPreference>, InferCreationAttributes<AlertPreference>> {
  declare userId: number;
  declare organizationId: number;
  declare oilTooCold: CreationOptional<'email' | 'app'>;
  declare switchOn: CreationOptional<AlertChannel>;
  declare coldNight: CreationOptional<AlertChannel>;
  /** Master switch for every alert e-mail (invitations and password resets still go). */
  declare emailEnabled: CreationOptional<boolean>;
  /** Quiet hours, 'HH:MM' local in `timeZone`; both null: none. */
  declare quietStart: CreationOptional<string | null>;
  declare quietEnd: CreationOptional<string | null>;
  declare timeZone: CreationOptional<string | null>;
  /** Minutes before a hand-switched heater's switch-on time that the reminder goes. */
  declare reminderLeadMinutes: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAlertPreference(sequelize: Sequelize) {
  AlertPreference.init(
    {
      userId: { type: DataTypes.INTEGER, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      oilTooCold: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'email' },
      switchOn: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'email' },
      coldNight: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'email' },
      emailEnabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      quietStart: { type: DataTypes.STRING(5), allowNull: true },
      quietEnd: { type: DataTypes.STRING(5), allowNull: true },
      timeZone: { type: DataTypes.STRING(64), allowNull: true },
      reminderLeadMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'alert_preferences' },
  );
}
