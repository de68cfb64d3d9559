import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const orgRef = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' };

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('organizations', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    coldNightThresholdC: { type: DataTypes.FLOAT, allowNull: false, defaultValue: -5 },
    coldNightNoticeAt: { type: DataTypes.STRING(5), allowNull: false, defaultValue: '18:00' },
    ...timestamps,
  });
  await q.createTable('users', {
    id,
    organizationId: orgRef,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    mustChangePassword: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    tempUnit: { type: DataTypes.STRING(1), allowNull: false, defaultValue: 'C' },
    volumeUnit: { type: DataTypes.STRING(2), allowNull: false, defaultValue: 'L' },
    ...timestamps,
  });
  await q.addIndex('users', ['organizationId']);
  await q.createTable('airfields', {
    id,
    organizationId: orgRef,
    name: { type: DataTypes.STRING(120), allowNull: false },
    ident: { type: DataTypes.STRING(8), allowNull: false },
    latitude: { type: DataTypes.FLOAT, allowNull: false },
    longitude: { type: DataTypes.FLOAT, allowNull: false },
    elevationM: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    timeZone: { type: DataTypes.STRING(64), allowNull: false },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('airfields', ['organizationId']);
  await q.createTable('shelters', {
    id,
    organizationId: orgRef,
    airfieldId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'airfields', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    heatCapacityJPerK: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    lossWPerK: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    setpointC: { type: DataTypes.FLOAT, allowNull: true },
    heatingPowerW: { type: DataTypes.FLOAT, allowNull: true },
    solarApertureM2: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('shelters', ['organizationId', 'airfieldId']);
  await q.createTable('aircraft', {
    id,
    organizationId: orgRef,
    shelterId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'shelters', key: 'id' }, onDelete: 'SET NULL' },
    registration: { type: DataTypes.STRING(12), allowNull: false },
    typeLabel: { type: DataTypes.STRING(80), allowNull: false },
    engineClass: { type: DataTypes.STRING(32), allowNull: false },
    oilQuantityL: { type: DataTypes.FLOAT, allowNull: false },
    thermal: { type: DataTypes.JSON, allowNull: false },
    coverOnByDefault: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    lastShutdownAt: { type: DataTypes.DATE, allowNull: true },
    lastShutdownOilC: { type: DataTypes.FLOAT, allowNull: true },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('aircraft', ['organizationId']);
  await q.addIndex('aircraft', ['organizationId', 'registration'], { unique: true });
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of ['aircraft', 'shelters', 'airfields', 'users', 'organizations']) await q.dropTable(t);
}
