import type { QueryInterface } from 'sequelize';

// One stored Heat plan per departure, enforced by a named unique index (plans are written with an
// upsert on it, so simultaneous board reads and the plan job never store two). Older databases may
// hold duplicates from before: the newest row of each departure is kept.
const INDEX = 'heat_plans_departure_unique';

export async function up({ context: q }: { context: QueryInterface }) {
  const qi = (s: string) => q.quoteIdentifier(s);
  await q.sequelize.query(
    `DELETE FROM ${qi('heat_plans')} WHERE ${qi('id')} NOT IN (SELECT MAX(${qi('id')}) FROM ${qi('heat_plans')} GROUP BY ${qi('departureId')})`,
  );
  await q.addIndex('heat_plans', ['departureId'], { unique: true, name: INDEX });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeIndex('heat_plans', INDEX);
}
