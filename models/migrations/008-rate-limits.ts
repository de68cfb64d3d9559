import { DataTypes, type QueryInterface } from 'sequelize';

// The shared store of the sign-in and token-link limits on PostgreSQL (lib/auth/limiter.ts), in the
// layout rate-limiter-flexible's Postgres store reads. Created here rather than by the store itself at
// first use: the store's own creation runs in the background, so an instance's first sign-ins failed
// until it finished, and instances starting together raced on it. Unused (and empty) on SQLite, where
// the limits live in memory.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('rate_limits', {
    key: { type: DataTypes.STRING(255), primaryKey: true },
    points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    expire: { type: DataTypes.BIGINT, allowNull: true },
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('rate_limits');
}
