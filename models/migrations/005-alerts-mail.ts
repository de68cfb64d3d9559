import { DataTypes, type QueryInterface } from 'sequelize';

// Alerts and e-mail: in-app alerts, per-user alert preferences, the durable mail outbox, single-use
// e-mail tokens (invitations, password resets), job leases and what the local SMTP capture received.
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const ref = (model: string, allowNull = false, onDelete = 'CASCADE') => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' }, onDelete });

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('alerts', {
    id,
    organizationId: ref('organizations'),
    userId: ref('users'),
    kind: { type: DataTypes.STRING(24), allowNull: false },
    subjectKey: { type: DataTypes.STRING(160), allowNull: false },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    departureId: ref('departures', true, 'SET NULL'),
    airfieldId: ref('airfields', true, 'SET NULL'),
    title: { type: DataTypes.STRING(200), allowNull: false },
    data: { type: DataTypes.JSON, allowNull: false },
    state: { type: DataTypes.JSON, allowNull: false },
    link: { type: DataTypes.STRING(300), allowNull: false },
    acknowledgedAt: { type: DataTypes.DATE, allowNull: true },
    resolvedAt: { type: DataTypes.DATE, allowNull: true },
    supersededAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('alerts', ['userId', 'subjectKey', 'revision'], { unique: true, name: 'alerts_user_subject_revision' });
  await q.addIndex('alerts', ['organizationId', 'subjectKey']);
  await q.addIndex('alerts', ['userId', 'acknowledgedAt']);

  await q.createTable('alert_preferences', {
    userId: { ...ref('users'), primaryKey: true },
    organizationId: ref('organizations'),
    oilTooCold: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'email' },
    switchOn: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'email' },
    coldNight: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'email' },
    emailEnabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    quietStart: { type: DataTypes.STRING(5), allowNull: true },
    quietEnd: { type: DataTypes.STRING(5), allowNull: true },
    timeZone: { type: DataTypes.STRING(64), allowNull: true },
    reminderLeadMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
    ...timestamps,
  });

  await q.createTable('outbox_messages', {
    id,
    organizationId: ref('organizations', true),
    userId: ref('users', true, 'SET NULL'),
    alertId: ref('alerts', true, 'SET NULL'),
    kind: { type: DataTypes.STRING(24), allowNull: false },
    toAddress: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(250), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: false },
    headers: { type: DataTypes.JSON, allowNull: true },
    dedupeKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    messageId: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastError: { type: DataTypes.STRING(500), allowNull: true },
    nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
    expiresAt: { type: DataTypes.DATE, allowNull: true },
    claimedBy: { type: DataTypes.STRING(120), allowNull: true },
    claimedUntil: { type: DataTypes.DATE, allowNull: true },
    sentAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('outbox_messages', ['status', 'nextAttemptAt']);
  await q.addIndex('outbox_messages', ['organizationId', 'createdAt']);

  await q.createTable('tokens', {
    id,
    organizationId: ref('organizations'),
    userId: ref('users'),
    purpose: { type: DataTypes.STRING(12), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdById: ref('users', true, 'SET NULL'),
    ...timestamps,
  });
  await q.addIndex('tokens', ['userId', 'purpose']);

  await q.createTable('leases', {
    name: { type: DataTypes.STRING(64), primaryKey: true },
    holder: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    lastRunAt: { type: DataTypes.DATE, allowNull: true },
    runs: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });

  await q.createTable('captured_mails', {
    id,
    organizationId: ref('organizations', true),
    messageId: { type: DataTypes.STRING(250), allowNull: true, unique: true },
    envelopeFrom: { type: DataTypes.STRING(254), allowNull: false },
    recipients: { type: DataTypes.JSON, allowNull: false },
    fromHeader: { type: DataTypes.STRING(500), allowNull: false },
    toHeader: { type: DataTypes.STRING(500), allowNull: false },
    subject: { type: DataTypes.STRING(500), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: false },
    headers: { type: DataTypes.JSON, allowNull: false },
    raw: { type: DataTypes.TEXT, allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    receivedAt: { type: DataTypes.DATE, allowNull: false },
    ...timestamps,
  });
  await q.addIndex('captured_mails', ['organizationId', 'receivedAt']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of ['captured_mails', 'leases', 'tokens', 'outbox_messages', 'alert_preferences', 'alerts']) await q.dropTable(t);
}
