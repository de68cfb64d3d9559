// Pure: switch-on events as an iCalendar file (RFC 5545, written by the `ics` package).
import { createEvents, type EventAttributes } from 'ics';

export interface SwitchOnEvent {
  departureId: number;
  registration: string;
  airfieldName: string;
  shelterName: string | null;
  heaterLabel: string;
  control: string;
  switchOnAtMs: number;
  heaterOffAtMs: number;
  departAtMs: number;
  readyC: number;
  oilAtDepartureC: number | null;
  status: string;
  url: string;
  /** The end of the start window when the heater stays on past departure. */
  holdUntilMs?: number | null;
}

const CAUTION = 'Estimates only: the manufacturer’s cold-weather instructions, your procedures and local rules come first. Keep heaters and cords away from fuel and fabric; never leave a combustion heater unattended.';

/** One VEVENT per switch-on; the event runs while the heater is planned on and alarms 10 minutes before. */
export function switchOnCalendar(events: SwitchOnEvent[], calName: string): string {
  const items: EventAttributes[] = events.map((e) => ({
    uid: `switch-on-${e.departureId}-${e.switchOnAtMs}@thawline`,
    start: e.switchOnAtMs,
    startInputType: 'utc',
    startOutputType: 'utc',
    end: Math.max(e.heaterOffAtMs, e.switchOnAtMs + 60_000),
    endInputType: 'utc',
    endOutputType: 'utc',
    title: `Switch on ${e.heaterLabel.toLowerCase()}: ${e.registration}`,
    location: [e.airfieldName, e.shelterName].filter(Boolean).join(', '),
    description: [
      `Heat plan for ${e.registration}, departure ${new Date(e.departAtMs).toISOString().slice(0, 16).replace('T', ' ')} UTC.`,
      `Ready temperature ${e.readyC.toFixed(0)} °C; predicted oil at departure ${e.oilAtDepartureC === null ? 'unknown' : `${e.oilAtDepartureC.toFixed(0)} °C`} (${e.status}).`,
      `Heater: ${e.heaterLabel}, ${e.control}.`,
      ...(e.holdUntilMs ? [`Start window to ${new Date(e.holdUntilMs).toISOString().slice(11, 16)} UTC: leave on until just before start; unplug before start.`] : []),
      CAUTION,
      e.url,
    ].join('\n'),
    url: e.url,
    status: 'CONFIRMED',
    busyStatus: 'FREE',
    alarms: [{ action: 'display', description: `Switch on the heater of ${e.registration}`, trigger: { minutes: 10, before: true } }],
  }));
  const { error, value } = createEvents(items, { calName, productId: 'thawline/switch-on' });
  if (error || value === null) {
    if (!items.length) return ['BEGIN:VCALENDAR', 'VERSION:2.0', 'PRODID:thawline/switch-on', `X-WR-CALNAME:${calName}`, 'END:VCALENDAR', ''].join('\r\n');
    throw error ?? new Error('calendar could not be written');
  }
  return value;
}
