import { DataTypes, type QueryInterface } from 'sequelize';

// MQTT devices (relays and probes) with hashed credentials, their audit log and their readings.
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const ref = (model: string, allowNull = false, onDelete = 'CASCADE') => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' }, onDelete });

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('devices', {
    id,
    organizationId: ref('organizations'),
    kind: { type: DataTypes.STRING(8), allowNull: false },
    measures: { type: DataTypes.STRING(8), allowNull: true },
    aircraftId: ref('aircraft', true),
    shelterId: ref('shelters', true),
    label: { type: DataTypes.STRING(80), allowNull: false },
    name: { type: DataTypes.STRING(40), allowNull: false },
    secretHash: { type: DataTypes.STRING(100), allowNull: false },
    lastSeenAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('devices', ['organizationId', 'name'], { unique: true, name: 'devices_org_name' });
  await q.createTable('device_events', {
    id,
    organizationId: ref('organizations'),
    deviceId: ref('devices', true, 'SET NULL'),
    aircraftId: ref('aircraft', true, 'SET NULL'),
    kind: { type: DataTypes.STRING(12), allowNull: false },
    commandId: { type: DataTypes.STRING(64), allowNull: true },
    detail: { type: DataTypes.JSON, allowNull: false },
    userId: ref('users', true, 'SET NULL'),
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('device_events', ['organizationId', 'createdAt']);
  await q.addIndex('device_events', ['deviceId', 'commandId']);
  await q.createTable('device_readings', {
    id,
    organizationId: ref('organizations'),
    deviceId: ref('devices'),
    at: { type: DataTypes.DATE, allowNull: false },
    tempC: { type: DataTypes.FLOAT, allowNull: true },
    on: { type: DataTypes.BOOLEAN, allowNull: true },
    powerW: { type: DataTypes.FLOAT, allowNull: true },
    /** A reading outside the plausible range is stored flagged and never trusted. */
    flagged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  });
  await q.addIndex('device_readings', ['deviceId', 'at']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('device_readings');
  await q.dropTable('device_events');
  await q.dropTable('devices');
}
