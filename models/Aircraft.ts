import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Shelter } from './Shelter';

/** Thermal parameters of the engine: one node (oil and engine together) or two (oil; engine mass). */
export interface ThermalParams {
  nodes: { name: 'oil' | 'engine'; heatCapacityJPerK: number; lossWPerK: number }[];
  couplingWPerK?: number;
  /** Loss coefficients are multiplied by this when the cover is on (0 < f ≤ 1). */
  coverFactor: number;
  /** k in G(v) = G0·(1 + k·√v) on an open tie-down. */
  windCoefficient?: number;
  source: 'preset' | 'manual' | 'fitted';
}

export class Aircraft extends Model<InferAttributes<Aircraft>, InferCreationAttributes<Aircraft>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare shelterId: ForeignKey<Shelter['id']> | null;
  declare registration: string;
  declare typeLabel: string;
  declare engineClass: string;
  declare oilQuantityL: number;
  declare thermal: ThermalParams;
  declare coverOnByDefault: CreationOptional<boolean>;
  declare lastShutdownAt: CreationOptional<Date | null>;
  declare lastShutdownOilC: CreationOptional<number | null>;
  /** Engine-mass threshold, °C; null: the engine class's (estimate). */
  declare engineReadyC: CreationOptional<number | null>;
  /** The maker's rule from the aircraft's manual; null: the engine class's (estimate). */
  declare preheatBelowC: CreationOptional<number | null>;
  declare preheatSoakHours: CreationOptional<number | null>;
  declare minStartOilC: CreationOptional<number | null>;
  declare archivedAt: CreationOptional<Date | null>;
  /** Oil change due after this many engine hours since the last change (null: not set). */
  declare oilChangeIntervalHours: CreationOptional<number | null>;
  /** Oil change due after this many months since the last change (null: not set). */
  declare oilChangeIntervalMonths: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAircraft(sequelize: Sequelize) {
  Aircraft.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      shelterId: { type: DataTypes.INTEGER, allowNull: true },
      registration: { type: DataTypes.STRING(12), allowNull: false },
      typeLabel: { type: DataTypes.STRING(80), allowNull: false },
      engineClass: { type: DataTypes.STRING(32), allowNull: false },
      oilQuantityL: { type: DataTypes.FLOAT, allowNull: false },
      thermal: { type: DataTypes.JSON, allowNull: false },
      coverOnByDefault: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      lastShutdownAt: { type: DataTypes.DATE, allowNull: true },
      lastShutdownOilC: { type: DataTypes.FLOAT, allowNull: true },
      engineReadyC: { type: DataTypes.FLOAT, allowNull: true },
      preheatBelowC: { type: DataTypes.FLOAT, allowNull: true },
      preheatSoakHours: { type: DataTypes.FLOAT, allowNull: true },
      minStartOilC: { type: DataTypes.FLOAT, allowNull: true },
      archivedAt: { type: DataTypes.DATE, allowNull: true },
      oilChangeIntervalHours: { type: DataTypes.FLOAT, allowNull: true },
      oilChangeIntervalMonths: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Aircraft', tableName: 'aircraft' },
  );
}
