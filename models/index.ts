import { Umzug, SequelizeStorage } from 'umzug';
import { getSequelize } from './db';
import { Organization, initOrganization } from './Organization';
import { User, initUser } from './User';
import { Airfield, initAirfield } from './Airfield';
import { Shelter, initShelter } from './Shelter';
import { Aircraft, initAircraft } from './Aircraft';
import { Forecast, initForecast } from './Forecast';
import { TempLog, initTempLog } from './TempLog';
import { ProfileRevision, initProfileRevision } from './ProfileRevision';
import { OilCheck, initOilCheck } from './OilCheck';
import { OilChange, initOilChange } from './OilChange';
import { Heater, initHeater } from './Heater';
import { AircraftPilot, initAircraftPilot } from './AircraftPilot';
import { Tariff, initTariff } from './Tariff';
import { Device, initDevice } from './Device';
import { DeviceEvent, initDeviceEvent } from './DeviceEvent';
import { DeviceReading, initDeviceReading } from './DeviceReading';
import { Departure, initDeparture } from './Departure';
import { HeatPlan, initHeatPlan } from './HeatPlan';
import { CalendarFeed, initCalendarFeed } from './CalendarFeed';
import { Alert, initAlert } from './Alert';
import { AlertPreference, initAlertPreference } from './AlertPreference';
import { OutboxMessage, initOutboxMessage } from './OutboxMessage';
import { Token, initToken } from './Token';
import { Lease, initLease } from './Lease';
import { CapturedMail, initCapturedMail } from './CapturedMail';
import { DepartureOutcome, initDepartureOutcome } from './DepartureOutcome';
import { migrations } from './migrations';
import { guardWrites } from './transaction';

export { Organization, User, Airfield, Shelter, Aircraft, Forecast, Heater, AircraftPilot, Tariff, Departure, HeatPlan, CalendarFeed, TempLog, ProfileRevision, OilCheck, OilChange };
export { Alert, AlertPreference, OutboxMessage, Token, Lease, CapturedMail, DepartureOutcome };
export { Device, DeviceEvent, DeviceReading };
export { getSequelize, closeSequelize } from './db';

const g = globalThis as unknown as { __thawlineModelsReady?: boolean };

/** Defines every model and association on the shared instance (once per process). */
export function db() {
  const sequelize = getSequelize();
  guardWrites(sequelize);
  if (!g.__thawlineModelsReady || !Organization.sequelize || Organization.sequelize !== sequelize) {
    initOrganization(sequelize);
    initUser(sequelize);
    initAirfield(sequelize);
    initShelter(sequelize);
    initAircraft(sequelize);
    initForecast(sequelize);
    initHeater(sequelize);
    initAircraftPilot(sequelize);
    initTariff(sequelize);
    initDeparture(sequelize);
    initHeatPlan(sequelize);
    initCalendarFeed(sequelize);
    initTempLog(sequelize);
    initProfileRevision(sequelize);
    initOilCheck(sequelize);
    initOilChange(sequelize);
    initAlert(sequelize);
    initAlertPreference(sequelize);
    initOutboxMessage(sequelize);
    initToken(sequelize);
    initLease(sequelize);
    initCapturedMail(sequelize);
    initDepartureOutcome(sequelize);
    initDevice(sequelize);
    initDeviceEvent(sequelize);
    initDeviceReading(sequelize);

    Organization.hasMany(User, { foreignKey: 'organizationId' });
    User.belongsTo(Organization, { foreignKey: 'organizationId' });
    Organization.hasMany(Airfield, { foreignKey: 'organizationId' });
    Airfield.hasMany(Shelter, { foreignKey: 'airfieldId', as: 'shelters' });
    Shelter.belongsTo(Airfield, { foreignKey: 'airfieldId', as: 'airfield' });
    Shelter.hasMany(Aircraft, { foreignKey: 'shelterId', as: 'aircraft' });
    Aircraft.belongsTo(Shelter, { foreignKey: 'shelterId', as: 'shelter' });
    Airfield.hasOne(Forecast, { foreignKey: 'airfieldId', as: 'forecast' });
    Aircraft.hasMany(Heater, { foreignKey: 'aircraftId', as: 'heaters' });
    Heater.belongsTo(Aircraft, { foreignKey: 'aircraftId', as: 'aircraft' });
    Aircraft.belongsToMany(User, { through: AircraftPilot, foreignKey: 'aircraftId', otherKey: 'userId', as: 'pilots' });
    User.belongsToMany(Aircraft, { through: AircraftPilot, foreignKey: 'userId', otherKey: 'aircraftId', as: 'flies' });
    Airfield.hasOne(Tariff, { foreignKey: 'airfieldId', as: 'tariff' });
    Aircraft.hasMany(Departure, { foreignKey: 'aircraftId', as: 'departures' });
    Departure.belongsTo(Aircraft, { foreignKey: 'aircraftId', as: 'aircraft' });
    Departure.belongsTo(User, { foreignKey: 'pilotId', as: 'pilot' });
    Departure.hasOne(HeatPlan, { foreignKey: 'departureId', as: 'plan' });
    HeatPlan.belongsTo(Departure, { foreignKey: 'departureId', as: 'departure' });
    TempLog.belongsTo(User, { foreignKey: 'uploadedById', as: 'uploader' });
    ProfileRevision.belongsTo(User, { foreignKey: 'createdById', as: 'author' });
    OilCheck.belongsTo(User, { foreignKey: 'userId', as: 'author' });
    OilChange.belongsTo(User, { foreignKey: 'userId', as: 'author' });
    Alert.belongsTo(User, { foreignKey: 'userId', as: 'recipient' });
    OutboxMessage.belongsTo(Alert, { foreignKey: 'alertId', as: 'alert' });
    AlertPreference.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    Token.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    Departure.hasOne(DepartureOutcome, { foreignKey: 'departureId', as: 'outcome' });
    DepartureOutcome.belongsTo(Departure, { foreignKey: 'departureId', as: 'departure' });
    g.__thawlineModelsReady = true;
  }
  return { sequelize, Organization, User, Airfield, Shelter, Aircraft, Forecast, Heater, AircraftPilot, Tariff, Departure, HeatPlan, CalendarFeed, TempLog, ProfileRevision, OilCheck, OilChange, Alert, AlertPreference, OutboxMessage, Token, Lease, CapturedMail, DepartureOutcome, Device, DeviceEvent, DeviceReading };
}

export function migrator() {
  const sequelize = getSequelize();
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

/** Key of the PostgreSQL advisory lock that lets one instance at a time prepare the database. */
const STARTUP_LOCK = 7_231_406;

/**
 * Runs `fn` while holding the database's start-up lock (PostgreSQL: a transaction-scoped advisory lock
 * on a connection of its own; SQLite: one process per file, no lock needed). Instances starting together
 * take turns: the first migrates (and seeds), the others then find nothing to do. `fn` must not take
 * the lock again.
 */
export async function withStartupLock<T>(fn: () => Promise<T>): Promise<T> {
  const { sequelize } = db();
  if (sequelize.getDialect() !== 'postgres') return fn();
  return sequelize.transaction(async (t) => {
    await sequelize.query(`SELECT pg_advisory_xact_lock(${STARTUP_LOCK})`, { transaction: t });
    return fn();
  });
}

/** Applies every pending migration without taking the start-up lock (inside withStartupLock()). */
export async function applyMigrations(): Promise<string[]> {
  db();
  return (await migrator().up()).map((m) => m.name);
}

/** Applies every pending migration, one instance at a time; a second run applies nothing. Returns the names applied. */
export async function migrate(): Promise<string[]> {
  return withStartupLock(applyMigrations);
}
