import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const ref = (model: string, allowNull = false, onDelete = 'CASCADE') => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' }, onDelete });

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('heaters', {
    id,
    organizationId: ref('organizations'),
    aircraftId: ref('aircraft'),
    kind: { type: DataTypes.STRING(32), allowNull: false },
    powerW: { type: DataTypes.FLOAT, allowNull: false },
    node: { type: DataTypes.STRING(8), allowNull: false },
    control: { type: DataTypes.STRING(8), allowNull: false },
    slotMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5 },
    ...timestamps,
  });
  await q.addIndex('heaters', ['aircraftId']);
  await q.createTable('aircraft_pilots', {
    aircraftId: { ...ref('aircraft'), primaryKey: true },
    userId: { ...ref('users'), primaryKey: true },
  });
  await q.createTable('tariffs', {
    id,
    organizationId: ref('organizations'),
    airfieldId: { ...ref('airfields'), unique: true },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    periods: { type: DataTypes.JSON, allowNull: false },
    weekdaySchedule: { type: DataTypes.JSON, allowNull: false },
    weekendSchedule: { type: DataTypes.JSON, allowNull: false },
    ...timestamps,
  });
  await q.createTable('departures', {
    id,
    organizationId: ref('organizations'),
    aircraftId: ref('aircraft'),
    pilotId: ref('users'),
    bookedById: ref('users'),
    departAt: { type: DataTypes.DATE, allowNull: false },
    readyC: { type: DataTypes.FLOAT, allowNull: false },
    floorC: { type: DataTypes.FLOAT, allowNull: true },
    notes: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    cancelledAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('departures', ['organizationId', 'departAt']);
  await q.addIndex('departures', ['aircraftId', 'departAt']);
  await q.createTable('heat_plans', {
    id,
    organizationId: ref('organizations'),
    departureId: { ...ref('departures'), unique: true },
    inputsKey: { type: DataTypes.STRING(64), allowNull: false },
    computedAt: { type: DataTypes.DATE, allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false },
    switchOnAt: { type: DataTypes.DATE, allowNull: true },
    oilAtDepartureC: { type: DataTypes.FLOAT, allowNull: false },
    energyKWh: { type: DataTypes.FLOAT, allowNull: false },
    cost: { type: DataTypes.FLOAT, allowNull: true },
    probabilityReady: { type: DataTypes.FLOAT, allowNull: true },
    result: { type: DataTypes.JSON, allowNull: false },
    confirmedById: ref('users', true, 'SET NULL'),
    confirmedAt: { type: DataTypes.DATE, allowNull: true },
    confirmedKey: { type: DataTypes.STRING(64), allowNull: true },
    ...timestamps,
  });
  await q.createTable('calendar_feeds', {
    id,
    organizationId: ref('organizations'),
    userId: ref('users'),
    airfieldId: ref('airfields', true),
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of ['calendar_feeds', 'heat_plans', 'departures', 'tariffs', 'aircraft_pilots', 'heaters']) await q.dropTable(t);
}
