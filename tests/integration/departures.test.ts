import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let list: typeof import('@/app/api/departures/route');
let one: typeof import('@/app/api/departures/[id]/route');
let data: typeof import('@/lib/data/departures');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;
let Departure: typeof import('@/models/Departure').Departure;

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const ZONE = 'Europe/Helsinki';

beforeAll(async () => {
  models = await freshDatabase();
  list = await import('@/app/api/departures/route');
  one = await import('@/app/api/departures/[id]/route');
  data = await import('@/lib/data/departures');
  Departure = (await import('@/models/Departure')).Departure;
});

async function aircraftId(registration: string) {
  return (await models.Aircraft.findOne({ where: { registration } }))!.id;
}
async function userId(email: string) {
  return (await models.User.findOne({ where: { email } }))!.id;
}

/** Local wall clock of an instant in a zone, read with Intl alone (independent of the code under test). */
function wallClock(ms: number, zone = ZONE) {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit' }).formatToParts(ms);
  const get = (t: string) => parts.find((p) => p.type === t)!.value;
  return { date: `${get('year')}-${get('month')}-${get('day')}`, time: `${get('hour')}:${get('minute')}` };
}

/** A local date `days` ahead (beyond the seeded week, so the aircraft are free). */
function localDay(days: number) {
  return wallClock(Date.now() + days * DAY).date;
}

describe('listing departures', () => {
  it('needs a session', async () => {
    signOut();
    expect((await call(list.GET as never)).status).toBe(401);
  });

  it('a pilot sees only the departures they fly; an operator sees everyone’s, with aircraft, heaters, shelter and airfield', async () => {
    const me = await signInAs(DEMO.pilot);
    const mine = (await call(list.GET as never)).body.departures;
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((d: { pilot: { id: number } }) => d.pilot.id === me.id)).toBe(true);
    await signInAs(DEMO.operator);
    const all = (await call(list.GET as never)).body.departures;
    expect(all.length).toBeGreaterThan(mine.length);
    const d = all[0];
    expect(d.aircraft.heaters).toBeDefined();
    expect(d.aircraft.shelter.name).toBeTruthy();
    expect(d.aircraft.airfield.timeZone).toBe(ZONE);
    expect(d.timeZone).toBe(ZONE);
    const times = all.map((x: { departAtMs: number }) => x.departAtMs);
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    // Nobody sees another organization's departures.
    expect(all.some((x: { aircraft: { registration: string } }) => x.aircraft.registration === 'Q-RIDGE')).toBe(false);
  });

  it('filters by time window and airfield; bad filters are 422 naming the field', async () => {
    await signInAs(DEMO.operator);
    const birch = (await models.Airfield.findOne({ where: { name: 'Birchmoor' } }))!.id;
    const r = await call(list.GET as never, { url: `/api/departures?airfieldId=${birch}` });
    expect(r.status).toBe(200);
    expect(r.body.departures.length).toBeGreaterThan(0);
    expect(r.body.departures.every((d: { aircraft: { airfield: { id: number } } }) => d.aircraft.airfield.id === birch)).toBe(true);
    const from = new Date(Date.now() + 3 * DAY).toISOString();
    const to = new Date(Date.now() + 4 * DAY).toISOString();
    const w = await call(list.GET as never, { url: `/api/departures?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}` });
    expect(w.body.departures.every((d: { departAtMs: number }) => d.departAtMs >= Date.parse(from) && d.departAtMs < Date.parse(to))).toBe(true);
    const bad = await call(list.GET as never, { url: '/api/departures?from=yesterday' });
    expect(bad.status).toBe(422);
    expect(bad.body.fields[0].field).toBe('from');
  });

  it('the demo has tomorrow morning booked: 6–8 club departures between 06:30 and 10:00 local, with the weak-heater and the no-heater aircraft', async () => {
    const tomorrow = localDay(1);
    const all = await data.listDepartures({ orgId: (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!.id, fromMs: Date.now(), toMs: Date.now() + 3 * DAY });
    const morning = all.filter((d) => d.localDate === tomorrow);
    expect(morning.length).toBeGreaterThanOrEqual(6);
    expect(morning.length).toBeLessThanOrEqual(8);
    for (const d of morning) {
      const t = wallClock(d.departAtMs).time;
      expect(t >= '06:30' && t <= '10:00').toBe(true);
    }
    const regs = morning.map((d) => d.aircraft.registration);
    expect(regs).toEqual(expect.arrayContaining(['Q-SIPI', 'Q-HALLA']));
    expect(morning.find((d) => d.aircraft.registration === 'Q-HALLA')!.aircraft.heaters).toHaveLength(0);
    expect(new Set(morning.map((d) => d.aircraft.airfield!.id)).size).toBeGreaterThan(1);
  });
});

describe('booking', () => {
  it('a pilot books an aircraft they may fly; the local time is read in the airfield’s zone and the ready temperature defaults from the class', async () => {
    const me = await signInAs(DEMO.pilot);
    const day = localDay(10);
    const r = await call(list.POST as never, { method: 'POST', body: { aircraftId: await aircraftId('Q-KAPA'), departAt: `${day}T07:30`, notes: 'Navigation exercise' } });
    expect(r.status).toBe(201);
    const d = r.body.departure;
    expect(wallClock(Date.parse(d.departAt))).toEqual({ date: day, time: '07:30' });
    expect(d.localDate).toBe(day);
    expect(d.pilot.id).toBe(me.id);
    expect(d.bookedBy.id).toBe(me.id);
    expect(d.readyC).toBe(20); // the liquid-cooled-head class preset's ready temperature
    expect(d.floorC).toBeNull();
    const again = (await call(list.GET as never)).body.departures;
    expect(again.some((x: { id: number }) => x.id === d.id)).toBe(true);
  });

  it('a pilot may not book an aircraft they may not fly (403), nor for someone else (403)', async () => {
    await signInAs(DEMO.pilot);
    const before = await Departure.count();
    const r = await call(list.POST as never, { method: 'POST', body: { aircraftId: await aircraftId('Q-VIIMA'), departAt: `${localDay(11)}T08:00` } });
    expect(r.status).toBe(403);
    expect(r.body.message).toMatch(/Q-VIIMA/);
    const r2 = await call(list.POST as never, {
      method: 'POST',
      body: { aircraftId: await aircraftId('Q-KAPA'), pilotId: await userId('pilot3@frostvale.test'), departAt: `${localDay(12)}T08:00` },
    });
    expect(r2.status).toBe(403);
    expect(await Departure.count()).toBe(before);
  });

  it('an operator books any aircraft for any pilot of the organization', async () => {
    const op = await signInAs(DEMO.operator);
    const p2 = await userId('pilot2@frostvale.test');
    const r = await call(list.POST as never, { method: 'POST', body: { aircraftId: await aircraftId('Q-SIPI'), pilotId: p2, departAt: `${localDay(10)}T09:00` } });
    expect(r.status).toBe(201);
    expect(r.body.departure.pilot.id).toBe(p2);
    expect(r.body.departure.bookedBy.id).toBe(op.id);
    const other = await call(list.POST as never, {
      method: 'POST',
      body: { aircraftId: await aircraftId('Q-TAIMI'), pilotId: await userId('pilot@ridgeway.test'), departAt: `${localDay(10)}T09:00` },
    });
    expect(other.status).toBe(422);
    expect(other.body.fields[0].field).toBe('pilotId');
  });

  it('the ready temperature may be raised but not lowered below the aircraft’s figure (422 naming readyC); the floor may not exceed it', async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-ROUTA');
    // Below the aircraft's own figure (the maker's minimum oil for start, −6 °C by the class's estimate) even an operator may not go.
    const low = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(13)}T08:00`, readyC: -10 } });
    expect(low.status).toBe(422);
    expect(low.body.fields[0].field).toBe('readyC');
    expect(low.body.fields[0].message).toMatch(/\u22126 °C/);
    const floor = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(13)}T08:00`, readyC: 25, floorC: 30 } });
    expect(floor.status).toBe(422);
    expect(floor.body.fields[0].field).toBe('floorC');
    const ok = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(13)}T08:00`, readyC: 25, floorC: 5 } });
    expect(ok.status).toBe(201);
    expect(ok.body.departure).toMatchObject({ readyC: 25, floorC: 5, classReadyC: 15 });
  });

  it('the start window: new departures take the organization default (30 min), 0–120 via POST and PATCH, else 422 naming holdMinutes', async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-ROUTA');
    const made = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(15)}T08:00` } });
    expect(made.status).toBe(201);
    expect(made.body.departure.holdMinutes).toBe(30);
    const depId = made.body.departure.id;
    for (const bad of [121, -1, 2.5, 'x']) {
      const r = await call(one.PATCH as never, { method: 'PATCH', body: { holdMinutes: bad }, params: { id: String(depId) } });
      expect(r.status).toBe(422);
      expect(r.body.fields[0].field).toBe('holdMinutes');
    }
    const zero = await call(one.PATCH as never, { method: 'PATCH', body: { holdMinutes: 0 }, params: { id: String(depId) } });
    expect(zero.status).toBe(200);
    expect(zero.body.departure.holdMinutes).toBe(0);
    const max = await call(one.PATCH as never, { method: 'PATCH', body: { holdMinutes: '120' }, params: { id: String(depId) } });
    expect(max.body.departure.holdMinutes).toBe(120);
    const own = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(17)}T08:00`, holdMinutes: 45 } });
    expect(own.body.departure.holdMinutes).toBe(45);
    const tooLong = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(19)}T08:00`, holdMinutes: 500 } });
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.fields[0].field).toBe('holdMinutes');
  });

  it("an operator may lower the ready temperature to the aircraft's figure, recorded (who, when); a pilot may not; outside −40…60 °C is 422", async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-ROUTA');
    const made = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(21)}T08:00` } });
    expect(made.status).toBe(201);
    const depId = String(made.body.departure.id);
    // The class's rule minimum (estimate) is the aircraft's figure until its own manual's is entered.
    expect(made.body.departure.lowestReadyC).toBe(-6);
    for (const bad of [-41, 61]) {
      const r = await call(one.PATCH as never, { method: 'PATCH', body: { readyC: bad }, params: { id: depId } });
      expect(r.status).toBe(422);
      expect(r.body.fields[0].field).toBe('readyC');
    }
    const below = await call(one.PATCH as never, { method: 'PATCH', body: { readyC: -10 }, params: { id: depId } });
    expect(below.status).toBe(422);
    expect(below.body.fields[0].message).toMatch(/aircraft’s figure/);
    const lowered = await call(one.PATCH as never, { method: 'PATCH', body: { readyC: -6 }, params: { id: depId } });
    expect(lowered.status).toBe(200);
    expect(lowered.body.departure.readyC).toBe(-6);
    expect(lowered.body.departure.readyLowered.by).toBeTruthy();
    expect(Date.parse(lowered.body.departure.readyLowered.at)).toBeGreaterThan(Date.now() - 60_000);
    const back = await call(one.PATCH as never, { method: 'PATCH', body: { readyC: 20 }, params: { id: depId } });
    expect(back.body.departure.readyLowered).toBeNull();
    await signInAs(DEMO.pilot);
    const pilotMine = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(23)}T08:00`, readyC: 0 } });
    expect(pilotMine.status).toBe(422);
    expect(pilotMine.body.fields[0].field).toBe('readyC');
    expect(pilotMine.body.fields[0].message).toMatch(/an operator may lower/);
  });

  it('bad input is 422 naming the field; a time in the past or too far ahead is 422 on departAt', async () => {
    await signInAs(DEMO.pilot);
    const none = await call(list.POST as never, { method: 'POST', body: { departAt: 'tomorrow', readyC: 'warm' } });
    expect(none.status).toBe(422);
    expect(none.body.fields.map((f: { field: string }) => f.field)).toEqual(expect.arrayContaining(['aircraftId', 'departAt', 'readyC']));
    const id = await aircraftId('Q-KAPA');
    const past = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: new Date(Date.now() - HOUR).toISOString() } });
    expect(past.status).toBe(422);
    expect(past.body.fields[0].field).toBe('departAt');
    const far = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: new Date(Date.now() + 90 * DAY).toISOString() } });
    expect(far.status).toBe(422);
    expect(far.body.fields[0].field).toBe('departAt');
    const feb30 = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: '2031-02-30T07:00' } });
    expect(feb30.status).toBe(422);
  });

  it('two departures of one aircraft on the same local day or within 12 h are a 409 with a clear message', async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-KUURA');
    const day = localDay(14);
    const first = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${day}T07:00` } });
    expect(first.status).toBe(201);
    const sameDay = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${day}T20:00` } });
    expect(sameDay.status).toBe(409);
    expect(sameDay.body.message).toMatch(/Q-KUURA already has a departure at .*07:00.*Europe\/Helsinki/);
    // 22:00 the evening before is another day but under 12 h earlier.
    const prevEvening = wallClock(Date.parse(first.body.departure.departAt) - 9 * HOUR);
    const close = await call(list.POST as never, { method: 'POST', body: { aircraftId: id, departAt: `${prevEvening.date}T${prevEvening.time}` } });
    expect(close.status).toBe(409);
    // Another aircraft the same morning is fine.
    const other = await call(list.POST as never, { method: 'POST', body: { aircraftId: await aircraftId('Q-TAIMI'), departAt: `${day}T07:00` } });
    expect(other.status).toBe(201);
  });

  it("another organization's aircraft is 404", async () => {
    await signInAs(DEMO.operator);
    const r = await call(list.POST as never, { method: 'POST', body: { aircraftId: await aircraftId('Q-RIDGE'), departAt: `${localDay(10)}T07:00` } });
    expect(r.status).toBe(404);
  });
});

describe('changing and cancelling', () => {
  async function bookAsPilot(reg: string, days: number, time = '07:15') {
    await signInAs(DEMO.pilot);
    const r = await call(list.POST as never, { method: 'POST', body: { aircraftId: await aircraftId(reg), departAt: `${localDay(days)}T${time}` } });
    expect(r.status).toBe(201);
    return String(r.body.departure.id);
  }

  it('a pilot raises the ready temperature of their departure, moves it, but cannot hand it to someone else', async () => {
    const id = await bookAsPilot('Q-HALLA', 15);
    const r = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { readyC: 18, departAt: `${localDay(15)}T09:45` } });
    expect(r.status).toBe(200);
    expect(r.body.departure.readyC).toBe(18);
    expect(wallClock(Date.parse(r.body.departure.departAt)).time).toBe('09:45');
    const hand = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { pilotId: await userId('pilot2@frostvale.test') } });
    expect(hand.status).toBe(403);
    const lower = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { readyC: 5 } });
    expect(lower.status).toBe(422);
    expect(lower.body.fields[0].field).toBe('readyC');
  });

  it('moving a departure onto a day the aircraft is already booked is a 409', async () => {
    await bookAsPilot('Q-HALLA', 16);
    const id = await bookAsPilot('Q-HALLA', 18);
    const r = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { departAt: `${localDay(16)}T11:00` } });
    expect(r.status).toBe(409);
  });

  it("another pilot's departure is 404 for a pilot; another organization's is 404 for everyone", async () => {
    const id = await bookAsPilot('Q-KAPA', 17);
    await signInAs('pilot3@frostvale.test');
    expect((await call(one.GET as never, { params: { id } })).status).toBe(404);
    expect((await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { notes: 'mine' } })).status).toBe(404);
    expect((await call(one.DELETE as never, { method: 'DELETE', params: { id } })).status).toBe(404);
    await signInAs(DEMO.otherManager);
    expect((await call(one.GET as never, { params: { id } })).status).toBe(404);
    expect((await call(one.DELETE as never, { method: 'DELETE', params: { id } })).status).toBe(404);
    await signInAs(DEMO.operator);
    expect((await call(one.GET as never, { params: { id } })).status).toBe(200);
  });

  it('DELETE cancels: the departure leaves the list, cannot be changed, and the day is free again', async () => {
    const id = await bookAsPilot('Q-SIPI', 19);
    const r = await call(one.DELETE as never, { method: 'DELETE', params: { id } });
    expect(r.status).toBe(200);
    expect(r.body.departure.cancelled).toBe(true);
    const listed = (await call(list.GET as never, { url: `/api/departures?to=${encodeURIComponent(new Date(Date.now() + 30 * DAY).toISOString())}` })).body.departures;
    expect(listed.some((d: { id: number }) => String(d.id) === id)).toBe(false);
    expect((await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { notes: 'x' } })).status).toBe(409);
    expect((await call(one.DELETE as never, { method: 'DELETE', params: { id } })).status).toBe(409);
    await bookAsPilot('Q-SIPI', 19, '08:00');
  });
});
