import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A named lease on a recurring job: whoever holds an unexpired lease runs the job; the others skip it.
 * Taken and renewed by one conditional UPDATE (expired, or already ours), so two app instances on
 * one database never both hold it.
 */
export class Lease extends Model<InferAttributes<Lease>, InferCreationAttributes<Lease>> {
  declare name: string;
  declare holder: CreationOptional<string>;
  declare expiresAt: Date;
  declare lastRunAt: CreationOptional<Date | null>;
  declare runs: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLease(sequelize: Sequelize) {
  Lease.init(
    {
      name: { type: DataTypes.STRING(64), primaryKey: true },
      holder: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      lastRunAt: { type: DataTypes.DATE, allowNull: true },
      runs: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'leases' },
  );
}
