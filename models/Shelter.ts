import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Airfield } from './Airfield';
import { SHELTER_KINDS, type ShelterKind } from '@/lib/validation/airfields';

export { SHELTER_KINDS, type ShelterKind };

export class Shelter extends Model<InferAttributes<Shelter>, InferCreationAttributes<Shelter>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare airfieldId: ForeignKey<Airfield['id']>;
  declare name: string;
  declare kind: ShelterKind;
  /** Air and structure heat capacity (J/K); unused for a tie-down. */
  declare heatCapacityJPerK: number;
  /** Heat loss to outside air (W/K); unused for a tie-down. */
  declare lossWPerK: number;
  /** Heated hangar set-point (°C). */
  declare setpointC: CreationOptional<number | null>;
  /** Heated hangar heating power (W). */
  declare heatingPowerW: CreationOptional<number | null>;
  /** Effective solar aperture of the roof: absorptance × area (m²). */
  declare solarApertureM2: CreationOptional<number>;
  declare archivedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initShelter(sequelize: Sequelize) {
  Shelter.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      airfieldId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      heatCapacityJPerK: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      lossWPerK: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      setpointC: { type: DataTypes.FLOAT, allowNull: true },
      heatingPowerW: { type: DataTypes.FLOAT, allowNull: true },
      solarApertureM2: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      archivedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Shelter', tableName: 'shelters' },
  );
}
