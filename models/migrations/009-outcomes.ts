import { DataTypes, type QueryInterface } from 'sequelize';

// Morning outcomes: per departure, whether it flew and the oil temperature shown at start, with a
// snapshot of what the stored Heat plan predicted when it was recorded (so the Season report never
// depends on plans being recomputed). One row per departure.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('departure_outcomes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' },
    departureId: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: 'departures', key: 'id' }, onDelete: 'CASCADE' },
    aircraftId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'aircraft', key: 'id' }, onDelete: 'CASCADE' },
    flown: { type: DataTypes.BOOLEAN, allowNull: false },
    oilAtStartC: { type: DataTypes.FLOAT, allowNull: true },
    recordedById: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    recordedAt: { type: DataTypes.DATE, allowNull: false },
    predictedOilC: { type: DataTypes.FLOAT, allowNull: true },
    probabilityReady: { type: DataTypes.FLOAT, allowNull: true },
    readyC: { type: DataTypes.FLOAT, allowNull: false },
    energyKWh: { type: DataTypes.FLOAT, allowNull: true },
    usualEnergyKWh: { type: DataTypes.FLOAT, allowNull: true },
    planStatus: { type: DataTypes.STRING(12), allowNull: true },
    thermalSource: { type: DataTypes.STRING(12), allowNull: true },
    notes: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('departure_outcomes', ['organizationId', 'aircraftId']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('departure_outcomes');
}
