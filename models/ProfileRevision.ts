import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organization } from './Organization';
import type { Aircraft, ThermalParams } from './Aircraft';
import type { User } from './User';
import type { TempLog } from './TempLog';

import { REVISION_KINDS, type RevisionKind } from '@/lib/views/logs';

export { REVISION_KINDS, type RevisionKind };

/**
 * One state of an aircraft's thermal profile, in the order it was taken. "initial" records the profile
 * as it was before the first change through Thawline's history, so there is always a way back.
 */
export class ProfileRevision extends Model<InferAttributes<ProfileRevision>, InferCreationAttributes<ProfileRevision>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare aircraftId: ForeignKey<Aircraft['id']>;
  declare kind: RevisionKind;
  declare thermal: ThermalParams;
  declare tempLogId: ForeignKey<TempLog['id']> | null;
  /** For a revert: the revision restored. */
  declare restoredFromId: CreationOptional<number | null>;
  /** Fit figures shown beside the revision (τ, RMSE, R², model), when it came from a fit. */
  declare summary: CreationOptional<Record<string, unknown> | null>;
  declare note: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initProfileRevision(sequelize: Sequelize) {
  ProfileRevision.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      aircraftId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(12), allowNull: false },
      thermal: { type: DataTypes.JSON, allowNull: false },
      tempLogId: { type: DataTypes.INTEGER, allowNull: true },
      restoredFromId: { type: DataTypes.INTEGER, allowNull: true },
      summary: { type: DataTypes.JSON, allowNull: true },
      note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      createdById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'ProfileRevision', tableName: 'profile_revisions' },
  );
}
