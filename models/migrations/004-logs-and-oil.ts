import { DataTypes, type QueryInterface } from 'sequelize';

// Fit from log and the Oil log: uploaded temperature logs, the history of aircraft thermal profiles,
// cold oil checks and oil changes, and each aircraft's oil-change interval.
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const orgRef = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' };
const aircraftRef = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'aircraft', key: 'id' }, onDelete: 'CASCADE' };
const userRef = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' };

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('temp_logs', {
    id,
    organizationId: orgRef,
    aircraftId: aircraftRef,
    uploadedById: userRef,
    fileName: { type: DataTypes.STRING(200), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    rowCount: { type: DataTypes.INTEGER, allowNull: false },
    startAt: { type: DataTypes.DATE, allowNull: false },
    endAt: { type: DataTypes.DATE, allowNull: false },
    hasAmbient: { type: DataTypes.BOOLEAN, allowNull: false },
    layout: { type: DataTypes.JSON, allowNull: false },
    warnings: { type: DataTypes.JSON, allowNull: false },
    points: { type: DataTypes.BLOB, allowNull: false },
    windowStartAt: { type: DataTypes.DATE, allowNull: true },
    windowEndAt: { type: DataTypes.DATE, allowNull: true },
    coverOn: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    fit: { type: DataTypes.JSON, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('temp_logs', ['organizationId', 'aircraftId']);

  await q.createTable('profile_revisions', {
    id,
    organizationId: orgRef,
    aircraftId: aircraftRef,
    kind: { type: DataTypes.STRING(12), allowNull: false },
    thermal: { type: DataTypes.JSON, allowNull: false },
    tempLogId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'temp_logs', key: 'id' }, onDelete: 'SET NULL' },
    restoredFromId: { type: DataTypes.INTEGER, allowNull: true },
    summary: { type: DataTypes.JSON, allowNull: true },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    createdById: userRef,
    ...timestamps,
  });
  await q.addIndex('profile_revisions', ['organizationId', 'aircraftId']);

  await q.createTable('oil_checks', {
    id,
    organizationId: orgRef,
    aircraftId: aircraftRef,
    userId: userRef,
    checkedAt: { type: DataTypes.DATE, allowNull: false },
    levelL: { type: DataTypes.FLOAT, allowNull: false },
    oilTempC: { type: DataTypes.FLOAT, allowNull: false },
    outsideTempC: { type: DataTypes.FLOAT, allowNull: false },
    bladesTurned: { type: DataTypes.INTEGER, allowNull: true },
    engineHours: { type: DataTypes.FLOAT, allowNull: true },
    addedL: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await q.addIndex('oil_checks', ['organizationId', 'aircraftId', 'checkedAt']);

  await q.createTable('oil_changes', {
    id,
    organizationId: orgRef,
    aircraftId: aircraftRef,
    userId: userRef,
    changedAt: { type: DataTypes.DATE, allowNull: false },
    engineHours: { type: DataTypes.FLOAT, allowNull: false },
    oilGrade: { type: DataTypes.STRING(40), allowNull: false },
    quantityL: { type: DataTypes.FLOAT, allowNull: true },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await q.addIndex('oil_changes', ['organizationId', 'aircraftId', 'changedAt']);

  await q.addColumn('aircraft', 'oilChangeIntervalHours', { type: DataTypes.FLOAT, allowNull: true });
  await q.addColumn('aircraft', 'oilChangeIntervalMonths', { type: DataTypes.INTEGER, allowNull: true });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeColumn('aircraft', 'oilChangeIntervalMonths');
  await q.removeColumn('aircraft', 'oilChangeIntervalHours');
  for (const t of ['oil_changes', 'oil_checks', 'profile_revisions', 'temp_logs']) await q.dropTable(t);
}
