import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { DeviceKind, ProbeMeasure } from '@/lib/devices/topics';

/**
 * An MQTT device of an organization: a relay switching one aircraft's relay-controlled heaters, or a
 * probe (oil or engine on an aircraft, air in a shelter). `name` is its topic segment and, with the
 * organization id, its MQTT user name; `secretHash` is the bcrypt hash of its generated password.
 */
export class Device extends Model<InferAttributes<Device>, InferCreationAttributes<Device>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare kind: DeviceKind;
  declare measures: ProbeMeasure | null;
  declare aircraftId: number | null;
  declare shelterId: number | null;
  declare label: string;
  declare name: string;
  declare secretHash: string;
  declare lastSeenAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initDevice(sequelize: Sequelize) {
  Device.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(8), allowNull: false },
      measures: { type: DataTypes.STRING(8), allowNull: true },
      aircraftId: { type: DataTypes.INTEGER, allowNull: true },
      shelterId: { type: DataTypes.INTEGER, allowNull: true },
      label: { type: DataTypes.STRING(80), allowNull: false },
      name: { type: DataTypes.STRING(40), allowNull: false },
      secretHash: { type: DataTypes.STRING(100), allowNull: false },
      lastSeenAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Device', tableName: 'devices' },
  );
}
