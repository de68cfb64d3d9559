import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const DEVICE_EVENT_KINDS = ['command', 'ack', 'override', 'refusal', 'timeout'] as const;
export type DeviceEventKind = (typeof DEVICE_EVENT_KINDS)[number];

/** The device audit log: every command sent, acknowledgement, override and interlock refusal. */
export class DeviceEvent extends Model<InferAttributes<DeviceEvent>, InferCreationAttributes<DeviceEvent>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number | null;
  declare aircraftId: number | null;
  declare kind: DeviceEventKind;
  /** The command id (for a command and its acknowledgement), else null. */
  declare commandId: string | null;
  declare detail: Record<string, unknown>;
  declare userId: number | null;
  declare createdAt: CreationOptional<Date>;
}

export function initDeviceEvent(sequelize: Sequelize) {
  DeviceEvent.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      deviceId: { type: DataTypes.INTEGER, allowNull: true },
      aircraftId: { type: DataTypes.INTEGER, allowNull: true },
      kind: { type: DataTypes.STRING(12), allowNull: false },
      commandId: { type: DataTypes.STRING(64), allowNull: true },
      detail: { type: DataTypes.JSON, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'DeviceEvent', tableName: 'device_events', updatedAt: false },
  );
}
