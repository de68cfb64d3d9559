import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { User } from './User';

/** A secret, revocable iCalendar feed of switch-on events: for one operator's airfields or one airfield. */
export class CalendarFeed extends Model<InferAttributes<CalendarFeed>, InferCreationAttributes<CalendarFeed>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare userId: ForeignKey<User['id']>;
  /** Null: every airfield of the organization. */
  declare airfieldId: CreationOptional<number | null>;
  /** SHA-256 of the secret token in the URL (the token itself is shown once). */
  declare tokenHash: string;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCalendarFeed(sequelize: Sequelize) {
  CalendarFeed.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      airfieldId: { type: DataTypes.INTEGER, allowNull: true },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'CalendarFeed', tableName: 'calendar_feeds' },
  );
}
