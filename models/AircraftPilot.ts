import { DataTypes, Model, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Aircraft } from './Aircraft';
import type { User } from './User';

/** A pilot who may book an aircraft. */
export class AircraftPilot extends Model<InferAttributes<AircraftPilot>, InferCreationAttributes<AircraftPilot>> {
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare userId: ForeignKey<User['id']>;
}

export function initAircraftPilot(sequelize: Sequelize) {
  AircraftPilot.init(
    {
      aircraftId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    },
    { sequelize, modelName: 'AircraftPilot', tableName: 'aircraft_pilots', timestamps: false },
  );
}
