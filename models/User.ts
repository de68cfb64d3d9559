import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '@/lib/auth/permissions';
import type { Organization } from './Organization';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string;
  declare active: CreationOptional<boolean>;
  /** Set when a manager gave a temporary password: the user is asked to choose their own. */
  declare mustChangePassword: CreationOptional<boolean>;
  /**
   * Signed sessions carry the version they were issued with; one that differs is refused. Raised by the
   * beforeSave hook below whenever the password, the role or the active flag changes, and on sign-out
   * (lib/auth/options.ts). Bulk User.update calls bypass the hook: change those fields through save().
   */
  declare sessionVersion: CreationOptional<number>;
  declare tempUnit: CreationOptional<'C' | 'F'>;
  declare volumeUnit: CreationOptional<'L' | 'qt'>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      mustChangePassword: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      tempUnit: { type: DataTypes.STRING(1), allowNull: false, defaultValue: 'C' },
      volumeUnit: { type: DataTypes.STRING(2), allowNull: false, defaultValue: 'L' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize,
      modelName: 'User',
      tableName: 'users',
      hooks: {
        // Every session of this user ends when what it stood for changes.
        beforeSave(user) {
          if (!user.isNewRecord && (user.changed('passwordHash') || user.changed('role') || user.changed('active'))) {
            user.sessionVersion = (user.sessionVersion ?? 0) + 1;
          }
        },
      },
    },
  );
}
