import { DataTypes, type QueryInterface } from 'sequelize';

// The start window: a departure is ready from its time through a hold (the heater stays on until just
// before start). The organization's default for new bookings, and each departure's own (0–120 min).
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('organizations', 'holdMinutes', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 });
  await q.addColumn('departures', 'holdMinutes', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 });
  // The whole engine: the aircraft's own engine-mass threshold, °C (null: the engine class's, an estimate).
  await q.addColumn('aircraft', 'engineReadyC', { type: DataTypes.FLOAT, allowNull: true });
  // The maker's rule from the aircraft's own manual (null: the engine class's, an estimate).
  await q.addColumn('aircraft', 'preheatBelowC', { type: DataTypes.FLOAT, allowNull: true });
  await q.addColumn('aircraft', 'preheatSoakHours', { type: DataTypes.FLOAT, allowNull: true });
  await q.addColumn('aircraft', 'minStartOilC', { type: DataTypes.FLOAT, allowNull: true });
  // A ready temperature lowered to the aircraft's figure: who and when.
  await q.addColumn('departures', 'readyLoweredById', { type: DataTypes.INTEGER, allowNull: true });
  await q.addColumn('departures', 'readyLoweredAt', { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const c of ['readyLoweredById', 'readyLoweredAt']) await q.removeColumn('departures', c);
  for (const c of ['preheatBelowC', 'preheatSoakHours', 'minStartOilC']) await q.removeColumn('aircraft', c);
  await q.removeColumn('aircraft', 'engineReadyC');
  await q.removeColumn('departures', 'holdMinutes');
  await q.removeColumn('organizations', 'holdMinutes');
}
