// What each alert says, from its stored data (SI units, ISO instants) and the reader's units. Pure and
// safe in client components: the alerts page and the e-mail templates read the same sentences.
import { formatDay, formatDayTime, formatTime, zoneLabel } from '@/lib/time';
import { formatTemp, toDisplayDelta, tempLabel, type TempUnit } from '@/lib/units';

export type AlertKind = 'oil-too-cold' | 'switch-on' | 'cold-night';
export type Audience = 'pilot' | 'operator' | 'manager';
import { READINESS_LABEL, type Readiness } from '@/lib/plans/state';
export { READINESS_LABEL, type Readiness };

export const ALERT_KIND_LABEL: Record<AlertKind, string> = {
  'oil-too-cold': 'Oil-too-cold warning',
  'switch-on': 'Switch-on reminder',
  'cold-night': 'Cold-night notice',
};


interface AirfieldRef {
  id: number;
  name: string;
  ident: string;
  timeZone: string;
}

export interface OilTooColdData {
  departureId: number;
  departAt: string;
  readyC: number;
  aircraft: { id: number; registration: string; typeLabel: string; coverOnByDefault: boolean };
  airfield: AirfieldRef;
  shelter: { name: string; kind: string } | null;
  pilot: { id: number; name: string };
  status: 'short' | 'unplanned';
  summary: string;
  oilAtDepartureC: number | null;
  probabilityReady: number | null;
  heater: { kindLabel: string; powerW: number; control: string } | null;
  switchOnAt: string | null;
  fix: { readyAt: string | null; powerNeededW: number | null } | null;
  /** Frost likely on the airframe (outside overnight) before departure. */
  frost?: boolean;
}

export interface SwitchOnData {
  departureId: number;
  departAt: string;
  switchOnAt: string;
  readyC: number;
  status: Readiness;
  oilAtDepartureC: number | null;
  aircraft: { id: number; registration: string };
  airfield: AirfieldRef;
  shelter: { name: string; kind: string } | null;
  heater: { kindLabel: string; powerW: number };
  pilot: { id: number; name: string };
  /** Frost likely on the airframe (outside overnight) before departure. */
  frost?: boolean;
  /** The end of the start window when the plan keeps the heater on past departure. */
  holdUntil?: string | null;
}

export interface ColdNightData {
  thresholdC: number;
  timeZone: string;
  /** Local date of the evening the night starts on. */
  evening: string;
  night: { from: string; to: string };
  airfields: { id: number; name: string; ident: string; lowC: number; lowAt: string }[];
  aircraft: { departureId: number; registration: string; airfield: string; departAt: string; status: Readiness; switchOnAt: string | null; energyKWh: number }[];
  totals: { energyKWh: number; cost: number | null; currency: string };
}

export type AlertData = OilTooColdData | SwitchOnData | ColdNightData;

export interface Fact {
  label: string;
  value: string;
  strong?: boolean;
}
export interface Section {
  heading: string;
  items: string[];
  tone?: 'heat' | 'ice';
}

export interface Described {
  title: string;
  intro: string[];
  facts: Fact[];
  sections: Section[];
  table?: { caption: string; columns: string[]; rows: string[][]; footer?: string[] };
}

/** "Thu 3 Dec 07:30 EET" at the airfield. */
export function localWhen(iso: string, zone: string): string {
  const ms = Date.parse(iso);
  return `${formatDay(ms, zone)} ${formatTime(ms, zone)} ${zoneLabel(zone, ms)}`;
}
function shortWhen(iso: string, zone: string): string {
  return formatDayTime(Date.parse(iso), zone);
}
const temp = (c: number | null, unit: TempUnit) => (c === null ? 'not known' : formatTemp(c, unit, 0));
const kwh = (v: number) => `${v.toFixed(v >= 10 ? 0 : 1)} kWh`;
export function money(v: number | null, currency: string): string {
  if (v === null) return '—';
  try {
    return new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 2 }).format(v);
  } catch {
    return `${v.toFixed(2)} ${currency}`;
  }
}

function possessive(reg: string) {
  return `${reg}'s`;
}

// ---------------------------------------------------------------------------------------------
// Oil-too-cold warning

export function oilTooColdTitle(d: OilTooColdData): string {
  const when = shortWhen(d.departAt, d.airfield.timeZone);
  return d.status === 'short'
    ? `${d.aircraft.registration} will be too cold for the ${when} departure`
    : `${d.aircraft.registration} needs heat for the ${when} departure and has no heat plan`;
}

/** What would make the departure ready, most effective first. */
export function oilFixes(d: OilTooColdData, unit: TempUnit): string[] {
  const z = d.airfield.timeZone;
  const out: string[] = [];
  if (!d.heater) {
    out.push("Fit a preheater in the aircraft's profile, or move the aircraft into a heated hangar for the night.");
  } else if (d.status === 'unplanned') {
    out.push('Make a heat plan for this departure on the Morning board.');
  }
  if (d.fix?.readyAt) {
    out.push(`With the heater on from the earliest switch-on and kept on, the oil reaches ${formatTemp(d.readyC, unit, 0)} at ${localWhen(d.fix.readyAt, z)}: book the departure for then or later.`);
  }
  if (d.fix?.powerNeededW) {
    const fitted = d.heater ? ` (the fitted ${d.heater.kindLabel.toLowerCase()} gives ${Math.round(d.heater.powerW)} W)` : '';
    out.push(`A heater of at least ${Math.ceil(d.fix.powerNeededW / 10) * 10} W would reach the ready temperature in time${fitted}.`);
  }
  if (!d.aircraft.coverOnByDefault) out.push('Fit the engine cover for the night: it keeps the heat in.');
  if (d.shelter?.kind === 'tie-down') out.push('A hangar place for the night would cut the heat lost to wind and open sky.');
  if (d.status === 'short' && !d.fix?.readyAt && !d.fix?.powerNeededW && d.heater) {
    out.push('No heater power within reach meets the ready temperature in time: move the aircraft somewhere warmer.');
  }
  out.push('Or book the flight later in the day, when the oil can be warm enough.');
  return out;
}

export function describeOilTooCold(d: OilTooColdData, unit: TempUnit, audience: Audience): Described {
  const z = d.airfield.timeZone;
  const when = localWhen(d.departAt, z);
  const oil = temp(d.oilAtDepartureC, unit);
  const ready = formatTemp(d.readyC, unit, 0);
  const who = audience === 'pilot' ? 'your departure' : `${possessive(d.pilot.name)} departure`;
  const why =
    d.status === 'short'
      ? d.heater
        ? 'The heat plan cannot bring the oil to the ready temperature in time.'
        : 'It cannot reach the ready temperature in time.'
      : d.heater
        ? 'It needs heat to be ready and has no heat plan.'
        : 'It needs heat to be ready and has no heater fitted.';
  const facts: Fact[] = [
    { label: 'Departure', value: `${when}, ${d.airfield.name} (${d.airfield.ident})` },
    { label: 'Predicted oil at departure', value: oil, strong: true },
    { label: 'Ready temperature', value: ready },
  ];
  if (d.oilAtDepartureC !== null && d.oilAtDepartureC < d.readyC) {
    facts.push({ label: 'Too cold by', value: `${toDisplayDelta(d.readyC - d.oilAtDepartureC, unit).toFixed(0)} °${unit === 'F' ? 'F' : 'C'}` });
  }
  facts.push({ label: 'Heater', value: d.heater ? `${d.heater.kindLabel}, ${Math.round(d.heater.powerW)} W${d.heater.control === 'manual' ? ', switched by hand' : ''}` : 'None fitted' });
  if (d.switchOnAt) facts.push({ label: 'Planned switch-on', value: localWhen(d.switchOnAt, z) });
  if (d.probabilityReady !== null) facts.push({ label: 'Chance of being ready', value: `${Math.round(d.probabilityReady * 100)} %` });
  if (d.shelter) facts.push({ label: 'Parked', value: d.shelter.name });
  if (audience !== 'pilot') facts.push({ label: 'Pilot', value: d.pilot.name });
  return {
    title: oilTooColdTitle(d),
    intro: [`${d.aircraft.registration} (${d.aircraft.typeLabel}), ${who} from ${d.airfield.name} on ${when}: the oil is predicted at ${oil} against a ready temperature of ${ready}. ${why}`],
    facts,
    sections: [{ heading: 'What would fix it', items: oilFixes(d, unit), tone: 'heat' }, ...(d.frost ? [FROST_SECTION] : [])],
  };
}

/** Frost on an airframe parked outside: the check before flight, in every message about that departure. */
const FROST_SECTION: Section = {
  heading: 'Frost likely on the airframe',
  items: ['The airframe is forecast below the frost point before departure: check and remove frost before flight.', 'No take-off with frost, ice or snow on wings, tail or propeller.'],
  tone: 'ice',
};

// ---------------------------------------------------------------------------------------------
// Switch-on reminder

export function switchOnTitle(d: SwitchOnData): string {
  // With its day: a reminder is read later than it is written, and a switch-on is often after midnight.
  return `Switch on ${possessive(d.aircraft.registration)} ${d.heater.kindLabel.toLowerCase()} at ${formatDayTime(Date.parse(d.switchOnAt), d.airfield.timeZone)}`;
}

export function describeSwitchOn(d: SwitchOnData, unit: TempUnit, nowMs: number): Described {
  const z = d.airfield.timeZone;
  const at = `${shortWhen(d.switchOnAt, z)} ${zoneLabel(z, Date.parse(d.switchOnAt))}`;
  // "It was due" only once the minute has passed: a reminder sent ahead never reads as late.
  const overdue = nowMs >= Date.parse(d.switchOnAt) + 60_000;
  const sections: Section[] = [];
  if (d.status === 'short') {
    sections.push({
      heading: 'Even with the heater on, the plan is short',
      items: [`The oil is predicted at ${temp(d.oilAtDepartureC, unit)} at departure against ${formatTemp(d.readyC, unit, 0)}. See the oil-too-cold warning for what would fix it.`],
      tone: 'heat',
    });
  }
  if (d.frost) sections.push(FROST_SECTION);
  sections.push({
    heading: 'At the aircraft',
    items: ['Check the heater, its cord and the socket before you switch on; keep the cord clear of fuel, fabric and wheels.', d.holdUntil
        ? `Ready from departure through ${localWhen(d.holdUntil, z)} (the start window): leave on until just before start; unplug before start.`
        : 'Leave the heater running until departure unless the plan says otherwise; unplug before start.'],
    tone: 'heat',
  });
  return {
    title: switchOnTitle(d),
    intro: [
      `${overdue ? `It was due at ${at}: switch it on now` : `Switch it on at ${at}`} so that the oil of ${d.aircraft.registration} reaches ${formatTemp(d.readyC, unit, 0)} by the departure on ${localWhen(d.departAt, z)}. This heater is switched by hand.`,
    ],
    facts: [
      { label: 'Switch on at', value: localWhen(d.switchOnAt, z), strong: true },
      { label: 'Heater', value: `${d.heater.kindLabel}, ${Math.round(d.heater.powerW)} W` },
      { label: 'Where', value: `${d.shelter ? `${d.shelter.name}, ` : ''}${d.airfield.name} (${d.airfield.ident})` },
      { label: 'Departure', value: `${localWhen(d.departAt, z)}, ${d.pilot.name}` },
      { label: 'Predicted oil at departure', value: temp(d.oilAtDepartureC, unit) },
      ...(d.holdUntil ? [{ label: 'Heater on until', value: `${localWhen(d.holdUntil, z)}: just before start; unplug before start` }] : []),
    ],
    sections,
  };
}

// ---------------------------------------------------------------------------------------------
// Cold-night notice

export function coldNightTitle(d: ColdNightData, unit: TempUnit = 'C'): string {
  const coldest = [...d.airfields].sort((a, b) => a.lowC - b.lowC)[0];
  const others = d.airfields.length - 1;
  return `Cold night: ${formatTemp(coldest.lowC, unit, 0)} forecast at ${coldest.name}${others > 0 ? ` and ${others} other airfield${others > 1 ? 's' : ''}` : ''}`;
}

export function describeColdNight(d: ColdNightData, unit: TempUnit): Described {
  const z = d.timeZone;
  const need = d.aircraft.filter((a) => a.status !== 'ready');
  const facts: Fact[] = d.airfields.map((a) => ({ label: `${a.name} (${a.ident})`, value: `low ${formatTemp(a.lowC, unit, 0)} at ${shortWhen(a.lowAt, z)}`, strong: true }));
  facts.push({ label: 'Threshold', value: formatTemp(d.thresholdC, unit, 0) });
  facts.push({ label: 'Night', value: `${localWhen(d.night.from, z)} to ${localWhen(d.night.to, z)}` });
  const intro = [
    `Tonight's forecast low is below your organization's threshold of ${formatTemp(d.thresholdC, unit, 0)} at ${d.airfields.length === 1 ? d.airfields[0].name : `${d.airfields.length} airfields`}.`,
    need.length
      ? `${need.length} aircraft booked for the morning need heat; their heat plans use ${kwh(d.totals.energyKWh)}${d.totals.cost !== null ? ` (${money(d.totals.cost, d.totals.currency)})` : ''} in all.`
      : 'No departure booked for the morning needs heat.',
  ];
  const sections: Section[] = [];
  const problems = need.filter((a) => a.status === 'short' || a.status === 'unplanned');
  if (problems.length) {
    sections.push({
      heading: 'Not ready with the current plans',
      items: problems.map((a) => `${a.registration} at ${a.airfield}, ${shortWhen(a.departAt, z)}: ${READINESS_LABEL[a.status].toLowerCase()}`),
      tone: 'heat',
    });
  }
  return {
    title: coldNightTitle(d, unit),
    intro,
    facts,
    sections,
    table: need.length
      ? {
          caption: 'Aircraft that need heat',
          columns: ['Aircraft', 'Departure', 'Status', 'Switch-on', 'Energy'],
          rows: need.map((a) => [`${a.registration}\n${a.airfield}`, shortWhen(a.departAt, z), READINESS_LABEL[a.status], a.switchOnAt ? shortWhen(a.switchOnAt, z) : '—', kwh(a.energyKWh)]),
          footer: ['Total planned', '', '', '', kwh(d.totals.energyKWh)],
        }
      : undefined,
  };
}

export function describeAlert(kind: AlertKind, data: AlertData, opts: { unit: TempUnit; audience: Audience; nowMs: number }): Described {
  if (kind === 'oil-too-cold') return describeOilTooCold(data as OilTooColdData, opts.unit, opts.audience);
  if (kind === 'switch-on') return describeSwitchOn(data as SwitchOnData, opts.unit, opts.nowMs);
  return describeColdNight(data as ColdNightData, opts.unit);
}

export { tempLabel };
