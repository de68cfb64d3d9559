import { DataTypes, type QueryInterface } from 'sequelize';

// Plans aim at a chance: the organization's "plan to be ready with this chance" (0.5–0.99, default 0.9).
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('organizations', 'targetChance', { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0.9 });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeColumn('organizations', 'targetChance');
}
