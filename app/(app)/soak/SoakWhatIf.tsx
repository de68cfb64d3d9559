'use client';
import { useEffect, useMemo, useState } from 'react';
import { SoakChart } from '@/components/charts/SoakChart';
import { Card, Notice } from '@/components/ui/primitives';
import { SelectField, TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { ENGINE_CLASSES, ENGINE_CLASS_IDS, HEATER_KINDS, SHELTER_KINDS, engineFromPreset, shelterFromPreset, type EngineClassId, type HeaterKind, type ShelterKind } from '@/lib/thermal/presets';
import { fromDisplayTemp, toDisplayTemp, tempLabel } from '@/lib/units';

interface Site {
  id: number;
  name: string;
  latitude: number;
  longitude: number;
  timeZone: string;
}
interface Point {
  at: string;
  outsideC: number;
  shelterC: number;
  oilC: number;
  engineC: number | null;
}
interface Result {
  series: Point[];
  energyWh: number;
  minimum: { at: string; oilC: number };
}

const HOUR = 3_600_000;

/** An invented but plausible winter night: warmest at 14:00, coldest at 07:00 (local), linear between hourly points. */
function nightProfile(startMs: number, hours: number, lowC: number, swingK: number, offsetHours: number) {
  const pts: { at: string; tempC: number }[] = [];
  for (let h = 0; h <= hours; h++) {
    const t = startMs + h * HOUR;
    const local = (((new Date(t).getUTCHours() + offsetHours) % 24) + 24) % 24;
    // Phase in the 24 h cycle: 0 at 07:00 (minimum), rising to 1 at 14:00, falling back over 17 h.
    const x = local >= 7 && local < 14 ? (local - 7) / 7 : local >= 14 ? 1 - (local - 14) / 17 : 1 - (local + 10) / 17;
    pts.push({ at: new Date(t).toISOString(), tempC: lowC + swingK * (0.5 - 0.5 * Math.cos(Math.PI * x)) });
  }
  return pts;
}

function zoneOffsetHours(timeZone: string, at: number) {
  const atMs = Math.floor(at / 60_000) * 60_000;
  const parts = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric' }).formatToParts(atMs);
  const get = (t: string) => Number(parts.find((p) => p.type === t)?.value);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'));
  return Math.round((asUtc - atMs) / 60_000) / 60;
}

/** The next local evening at the given hour, as epoch ms. */
function nextLocal(hour: number, timeZone: string, now = Date.now()) {
  const off = zoneOffsetHours(timeZone, now);
  const localNow = new Date(now + off * HOUR);
  const day = Date.UTC(localNow.getUTCFullYear(), localNow.getUTCMonth(), localNow.getUTCDate());
  return day + hour * HOUR - off * HOUR;
}

export function SoakWhatIf({ sites, units }: { sites: Site[]; units: 'C' | 'F' }) {
  const [siteId, setSiteId] = useState(sites[0]?.id ?? 0);
  const site = sites.find((s) => s.id === siteId) ?? { id: 0, name: 'UTC', latitude: 60, longitude: 25, timeZone: 'UTC' };
  const [engineClass, setEngineClass] = useState<EngineClassId>('ac-wetsump-4');
  const [shelter, setShelter] = useState<ShelterKind>('t-hangar');
  const [cover, setCover] = useState(true);
  const [heaterKind, setHeaterKind] = useState<HeaterKind | 'none'>('oil-pad');
  const [heaterW, setHeaterW] = useState(String(ENGINE_CLASSES['ac-wetsump-4'].heaters[0].powerW));
  const [shutdownHour, setShutdownHour] = useState('16');
  const [heatFrom, setHeatFrom] = useState('5');
  const [departHour, setDepartHour] = useState('8');
  const [low, setLow] = useState(String(Math.round(toDisplayTemp(-14, units))));
  const [result, setResult] = useState<Result | null>(null);
  const [error, setError] = useState('');
  const preset = ENGINE_CLASSES[engineClass];

  const request = useMemo(() => {
    const start = nextLocal(Number(shutdownHour) || 0, site.timeZone);
    const depart = start - (Number(shutdownHour) || 0) * HOUR + (24 + (Number(departHour) || 0)) * HOUR;
    const end = depart + 2 * HOUR;
    const heatStart = start - (Number(shutdownHour) || 0) * HOUR + (24 + (Number(heatFrom) || 0)) * HOUR;
    const lowC = fromDisplayTemp(Number(low), units);
    const off = zoneOffsetHours(site.timeZone, start);
    const engine = engineFromPreset(engineClass, { nodes: 2 });
    const power = Number(heaterW);
    const heaterNode = heaterKind === 'none' ? 'oil' : HEATER_KINDS[heaterKind].node;
    return {
      depart,
      body: {
        start: new Date(start).toISOString(),
        end: new Date(end).toISOString(),
        outputEveryMinutes: 10,
        outside: nightProfile(start, Math.ceil((end - start) / HOUR), Number.isFinite(lowC) ? lowC : -14, 8, off),
        shelter: shelterFromPreset(shelter),
        engine: { nodes: engine.nodes, couplingWPerK: engine.couplingWPerK, coverFactor: engine.coverFactor, windCoefficient: engine.windCoefficient },
        cover,
        site: { lat: site.latitude, lon: site.longitude },
        wind: [{ at: new Date(start).toISOString(), mps: 3 }],
        heaters: heaterKind !== 'none' && power > 0 && heatStart < depart ? [{ node: heaterNode, powerW: power, from: new Date(heatStart).toISOString(), to: new Date(depart).toISOString() }] : [],
      },
    };
  }, [site, engineClass, shelter, cover, heaterKind, heaterW, shutdownHour, heatFrom, departHour, low, units]);

  useEffect(() => {
    const t = setTimeout(async () => {
      const r = await sendJson<Result>('/api/v1/simulations', 'POST', request.body);
      if (r.ok) {
        setResult(r.data);
        setError('');
      } else setError(Object.values(r.fields)[0] ?? r.message);
    }, 250);
    return () => clearTimeout(t);
  }, [request]);

  const atDepart = result?.series.reduce<Point | null>((best, p) => (Math.abs(Date.parse(p.at) - request.depart) < Math.abs(Date.parse(best?.at ?? '') - request.depart) || !best ? p : best), null);
  const ready = preset.readyC;
  const hours = Array.from({ length: 24 }, (_, h) => h);
  const fmt = (c: number) => `${toDisplayTemp(c, units).toFixed(0)} ${tempLabel(units)}`;

  return (
    <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
      <Card aria-labelledby="whatif-h" className="space-y-4">
        <h2 id="whatif-h" className="text-base font-semibold">The night</h2>
        {sites.length ? (
          <SelectField id="site" label="Airfield (sun and local time)" value={siteId} onChange={(e) => setSiteId(Number(e.target.value))}>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>{s.name}</option>
            ))}
          </SelectField>
        ) : null}
        <SelectField id="engine" label="Engine class" value={engineClass} onChange={(e) => {
          const id = e.target.value as EngineClassId;
          setEngineClass(id);
          const h = ENGINE_CLASSES[id].heaters[0];
          if (h) {
            setHeaterKind(h.kind);
            setHeaterW(String(h.powerW));
          }
        }}>
          {ENGINE_CLASS_IDS.map((id) => (
            <option key={id} value={id}>{ENGINE_CLASSES[id].label}</option>
          ))}
        </SelectField>
        <SelectField id="shelter" label="Shelter" value={shelter} onChange={(e) => setShelter(e.target.value as ShelterKind)}>
          {(Object.keys(SHELTER_KINDS) as ShelterKind[]).map((k) => (
            <option key={k} value={k}>{SHELTER_KINDS[k].label}</option>
          ))}
        </SelectField>
        <label className="flex min-h-11 items-center gap-3 text-sm font-medium">
          <input type="checkbox" className="h-5 w-5 accent-ice-700" checked={cover} onChange={(e) => setCover(e.target.checked)} />
          Engine cover on
        </label>
        <TextField id="low" label={`Night low (${tempLabel(units)})`} type="number" inputMode="numeric" value={low} onChange={(e) => setLow(e.target.value)} />
        <SelectField id="shutdown" label="Last shutdown (today)" value={shutdownHour} onChange={(e) => setShutdownHour(e.target.value)}>
          {hours.filter((h) => h >= 10).map((h) => (
            <option key={h} value={h}>{String(h).padStart(2, '0')}:00</option>
          ))}
        </SelectField>
        <SelectField id="depart" label="Departure (tomorrow)" value={departHour} onChange={(e) => setDepartHour(e.target.value)}>
          {hours.filter((h) => h >= 5 && h <= 14).map((h) => (
            <option key={h} value={h}>{String(h).padStart(2, '0')}:00</option>
          ))}
        </SelectField>
        <SelectField id="heater" label="Heater" value={heaterKind} onChange={(e) => {
          const k = e.target.value as HeaterKind | 'none';
          setHeaterKind(k);
          if (k !== 'none') setHeaterW(String(HEATER_KINDS[k].typicalPowerW));
        }}>
          <option value="none">No heater</option>
          {(Object.keys(HEATER_KINDS) as HeaterKind[]).map((k) => (
            <option key={k} value={k}>{HEATER_KINDS[k].label}</option>
          ))}
        </SelectField>
        {heaterKind !== 'none' ? (
          <div className="grid grid-cols-2 gap-3">
            <TextField id="power" label="Power (W)" type="number" inputMode="numeric" value={heaterW} onChange={(e) => setHeaterW(e.target.value)} />
            <SelectField id="heatFrom" label="On from" value={heatFrom} onChange={(e) => setHeatFrom(e.target.value)}>
              {hours.filter((h) => h <= 12).map((h) => (
                <option key={h} value={h}>{String(h).padStart(2, '0')}:00</option>
              ))}
            </SelectField>
          </div>
        ) : null}
      </Card>
      <div className="space-y-4">
        <Card aria-labelledby="curve-h">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="curve-h" className="text-base font-semibold">Soak forecast · {site.name}</h2>
            <p className="text-xs text-slate-500 dark:text-slate-400">Times in {site.timeZone}</p>
          </div>
          <div role="status" aria-live="polite" className="mt-3 grid grid-cols-3 gap-2 text-center">
            <Stat label="Oil at departure" value={atDepart ? fmt(atDepart.oilC) : '…'} tone={atDepart && atDepart.oilC >= ready ? 'ok' : 'cold'} />
            <Stat label="Lowest oil" value={result ? fmt(result.minimum.oilC) : '…'} />
            <Stat label="Heater energy" value={result ? `${(result.energyWh / 1000).toFixed(2)} kWh` : '…'} />
          </div>
          {error ? <p className="mt-3 text-sm text-red-700 dark:text-red-300">{error}</p> : null}
          <div className="mt-4">
            {result ? (
              <SoakChart
                series={result.series}
                readyC={ready}
                heaterBands={request.body.heaters.map((h) => ({ from: h.from, to: h.to }))}
                timeZone={site.timeZone}
                units={units}
              />
            ) : (
              <div className="h-64 animate-pulse rounded-xl bg-slate-100 dark:bg-slate-800" />
            )}
          </div>
          <p className="mt-3 text-xs text-slate-500 dark:text-slate-400">
            Ready line: {fmt(ready)}, the class default. An invented night profile with the low you choose; the Morning board uses the airfield&apos;s forecast.
          </p>
        </Card>
        <Notice tone="caution" title="Estimates only">
          Follow the engine and aircraft manufacturer&apos;s cold-weather instructions, your operator&apos;s procedures and local rules: they override anything shown here. Preheaters can start fires — keep heaters and cords away from fuel and fabric and never leave a combustion heater unattended.
        </Notice>
      </div>
    </div>
  );
}

function Stat({ label, value, tone }: { label: string; value: string; tone?: 'ok' | 'cold' }) {
  const color = tone === 'ok' ? 'text-teal-700 dark:text-teal-300' : tone === 'cold' ? 'text-ice-700 dark:text-ice-300' : 'text-slate-900 dark:text-white';
  return (
    <div className="rounded-xl bg-slate-50 px-2 py-3 dark:bg-slate-800/60">
      <div className={`text-lg font-semibold tabular-nums sm:text-2xl ${color}`}>{value}</div>
      <div className="text-[11px] uppercase tracking-wide text-slate-500 dark:text-slate-400">{label}</div>
    </div>
  );
}
