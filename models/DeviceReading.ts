import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One reading of a device: a probe's temperature, or a relay's state and measured power. */
export class DeviceReading extends Model<InferAttributes<DeviceReading>, InferCreationAttributes<DeviceReading>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare at: Date;
  declare tempC: number | null;
  declare on: boolean | null;
  declare powerW: number | null;
  declare flagged: CreationOptional<boolean>;
}

export function initDeviceReading(sequelize: Sequelize) {
  DeviceReading.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      deviceId: { type: DataTypes.INTEGER, allowNull: false },
      at: { type: DataTypes.DATE, allowNull: false },
      tempC: { type: DataTypes.FLOAT, allowNull: true },
      on: { type: DataTypes.BOOLEAN, allowNull: true },
      powerW: { type: DataTypes.FLOAT, allowNull: true },
      flagged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    },
    { sequelize, modelName: 'DeviceReading', tableName: 'device_readings', timestamps: false },
  );
}
