import { DataTypes, type QueryInterface } from 'sequelize';

// The per-airfield forecast cache, and an index for listing an airfield's shelters by name.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('forecasts', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' },
    airfieldId: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: 'airfields', key: 'id' }, onDelete: 'CASCADE' },
    source: { type: DataTypes.STRING(10), allowNull: false },
    fetchedAt: { type: DataTypes.DATE, allowNull: true },
    latitude: { type: DataTypes.FLOAT, allowNull: false },
    longitude: { type: DataTypes.FLOAT, allowNull: false },
    elevationM: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    hours: { type: DataTypes.JSON, allowNull: false },
    lastAttemptAt: { type: DataTypes.DATE, allowNull: true },
    lastErrorKind: { type: DataTypes.STRING(16), allowNull: true },
    lastErrorMessage: { type: DataTypes.STRING(300), allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('forecasts', ['organizationId']);
  await q.addIndex('shelters', ['airfieldId', 'name']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeIndex('shelters', ['airfieldId', 'name']);
  await q.dropTable('forecasts');
}
