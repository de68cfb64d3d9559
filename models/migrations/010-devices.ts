import { DataTypes, type QueryInterface } from 'sequelize';

// MQTT devices (relays and probes) with hashed credentials, and their audit log.
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
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('device_events');
  await q.dropTable('devices');
}
