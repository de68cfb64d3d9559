import { DataTypes, type QueryInterface } from 'sequelize';

// Sessions that end: each user has a session version. The signed session carries the version it was
// issued with; a request whose version differs is signed out. Signing out, a password change or reset,
// a role change, deactivation and reactivation add one.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('users', 'sessionVersion', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeColumn('users', 'sessionVersion');
}
