// A read-only aircraft profile (for pilots, and the heading of the edit page). Server-renderable.
import type { ReactNode } from 'react';
import { Card } from '@/components/ui/primitives';
import { ShelterKindIcon } from '@/components/airfields/ShelterKindIcon';
import { formatNumber } from '@/components/airfields/format';
import type { TempUnit, VolumeUnit } from '@/lib/units';
import type { AircraftRecord } from '@/lib/views/aircraft';
import { SHELTER_KIND_LABEL } from '@/lib/validation/airfields';
import { HEATER_CONTROL_HINT, HEATER_CONTROL_LABEL } from '@/lib/validation/aircraft';
import { fmtAt, fmtPower, fmtTemp, fmtVolume, totalPowerW } from './format';

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex justify-between gap-4 py-2 text-sm">
      <dt className="text-slate-600 dark:text-slate-400">{label}</dt>
      <dd className="text-right font-medium text-slate-900 dark:text-white">{children}</dd>
    </div>
  );
}

/** Badges under the page title: class, home, cover, heat. */
export function AircraftFacts({ a, volumeUnit }: { a: AircraftRecord; volumeUnit: VolumeUnit }) {
  const chip = 'inline-flex items-center gap-1.5 rounded-full px-2.5 py-1 text-xs font-semibold';
  return (
    <ul className="flex flex-wrap gap-2" aria-label="Summary">
      <li className={`${chip} bg-slate-100 text-slate-800 dark:bg-slate-800 dark:text-slate-200`}>{a.engineClassLabel}</li>
      <li className={`${chip} bg-slate-100 text-slate-800 dark:bg-slate-800 dark:text-slate-200`}>{fmtVolume(a.oilQuantityL, volumeUnit)} oil</li>
      {a.shelter ? (
        <li className={`${chip} bg-ice-50 text-ice-900 dark:bg-ice-950 dark:text-ice-100`}>
          <ShelterKindIcon kind={a.shelter.kind} className="h-4 w-4" />
          {a.shelter.name}
          {a.airfield ? ` · ${a.airfield.name}` : ''}
        </li>
      ) : (
        <li className={`${chip} bg-amber-100 text-amber-900 dark:bg-amber-950 dark:text-amber-100`}>No home shelter</li>
      )}
      <li className={`${chip} bg-slate-100 text-slate-800 dark:bg-slate-800 dark:text-slate-200`}>{a.coverOnByDefault ? 'Cover on' : 'No cover'}</li>
      <li className={`${chip} ${a.heaters.length ? 'bg-ember-50 text-ember-800 dark:bg-ember-900/40 dark:text-ember-200' : 'bg-slate-100 text-slate-700 dark:bg-slate-800 dark:text-slate-300'}`}>
        {a.heaters.length ? `${fmtPower(totalPowerW(a.heaters))} heat` : 'No heater'}
      </li>
      {a.archived ? <li className={`${chip} bg-slate-200 text-slate-800 dark:bg-slate-700 dark:text-slate-100`}>Archived</li> : null}
    </ul>
  );
}

export function AircraftSummary({ a, tempUnit, volumeUnit }: { a: AircraftRecord; tempUnit: TempUnit; volumeUnit: VolumeUnit }) {
  const zone = a.airfield?.timeZone;
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Card aria-labelledby="sum-engine">
        <h2 id="sum-engine" className="text-lg font-semibold">Engine and home</h2>
        <dl className="mt-2 divide-y divide-slate-200 dark:divide-slate-800">
          <Row label="Type">{a.typeLabel}</Row>
          <Row label="Engine class">{a.engineClassLabel}</Row>
          <Row label="Oil quantity">{fmtVolume(a.oilQuantityL, volumeUnit)}</Row>
          <Row label="Ready temperature (class)">{fmtTemp(a.classDefaults.readyC, tempUnit)}</Row>
          <Row label="Home shelter">
            {a.shelter ? (
              <>
                {a.shelter.name}
                <span className="block text-xs font-normal text-slate-500">
                  {SHELTER_KIND_LABEL[a.shelter.kind]}
                  {a.airfield ? ` · ${a.airfield.name} (${a.airfield.timeZone})` : ''}
                </span>
              </>
            ) : (
              'None yet'
            )}
          </Row>
          <Row label="Cover">{a.coverOnByDefault ? 'On by default' : 'Not fitted by default'}</Row>
        </dl>
      </Card>

      <Card aria-labelledby="sum-heat">
        <h2 id="sum-heat" className="text-lg font-semibold">Heaters</h2>
        {a.heaters.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">No heater fitted: its departures cannot get a Heat plan.</p>
        ) : (
          <ul className="mt-2 divide-y divide-slate-200 dark:divide-slate-800">
            {a.heaters.map((h) => (
              <li key={h.id} className="flex items-start justify-between gap-3 py-2 text-sm">
                <span>
                  <span className="font-medium text-slate-900 dark:text-white">{h.kindLabel}</span>
                  <span className="block text-xs text-slate-500">
                    Heats the {h.node} · {HEATER_CONTROL_LABEL[h.control]} ({HEATER_CONTROL_HINT[h.control].toLowerCase().replace(/\.$/, '')}) · {h.slotMinutes}-min steps
                  </span>
                </span>
                <span className="whitespace-nowrap rounded-full bg-ember-50 px-2.5 py-1 text-xs font-semibold text-ember-800 dark:bg-ember-900/40 dark:text-ember-200">{fmtPower(h.powerW)}</span>
              </li>
            ))}
          </ul>
        )}
      </Card>

      <Card aria-labelledby="sum-shut">
        <h2 id="sum-shut" className="text-lg font-semibold">Last shutdown</h2>
        <dl className="mt-2 divide-y divide-slate-200 dark:divide-slate-800">
          <Row label="Time">{a.lastShutdownAt ? fmtAt(a.lastShutdownAt, zone) : 'Not entered'}</Row>
          <Row label="Oil temperature">{a.lastShutdownOilC !== null ? fmtTemp(a.lastShutdownOilC, tempUnit) : `${fmtTemp(a.classDefaults.shutdownOilC, tempUnit)} (class typical)`}</Row>
        </dl>
      </Card>

      <Card aria-labelledby="sum-pilots">
        <h2 id="sum-pilots" className="text-lg font-semibold">Pilots who may book</h2>
        {a.pilots.length ? (
          <ul className="mt-2 flex flex-wrap gap-2">
            {a.pilots.map((p) => (
              <li key={p.id} className="rounded-full bg-slate-100 px-3 py-1 text-sm dark:bg-slate-800">{p.name}</li>
            ))}
          </ul>
        ) : (
          <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">Nobody listed; operators and managers can still book it.</p>
        )}
      </Card>

      <Card aria-labelledby="sum-thermal" className="lg:col-span-2">
        <h2 id="sum-thermal" className="text-lg font-semibold">Thermal parameters</h2>
        <p className="text-sm text-slate-600 dark:text-slate-400">
          {a.thermal.source === 'fitted' ? 'Fitted from a cool-down log.' : a.thermal.source === 'manual' ? 'Entered by hand.' : 'Estimated from the engine class.'}
        </p>
        <dl className="mt-2 grid gap-x-8 sm:grid-cols-2">
          {a.thermal.nodes.map((n) => (
            <div key={n.name} className="divide-y divide-slate-200 dark:divide-slate-800">
              <Row label={`${n.name === 'oil' ? 'Oil' : 'Engine'} heat capacity`}>{formatNumber(n.heatCapacityJPerK / 1000, 1)} kJ/K</Row>
              <Row label={`${n.name === 'oil' ? 'Oil' : 'Engine'} heat loss`}>{formatNumber(n.lossWPerK, 2)} W/K</Row>
            </div>
          ))}
          <div className="divide-y divide-slate-200 dark:divide-slate-800">
            {a.thermal.couplingWPerK !== undefined ? <Row label="Oil–engine coupling">{formatNumber(a.thermal.couplingWPerK, 2)} W/K</Row> : null}
            <Row label="Cover factor">{formatNumber(a.thermal.coverFactor, 2)}</Row>
          </div>
        </dl>
      </Card>
    </div>
  );
}
