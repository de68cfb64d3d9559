'use client';
// Create or edit a shelter. Choosing a kind fills the thermal values from that kind's preset (the
// soak model's); they stay editable. Values are shown in handy units (MJ/K, kW) and sent in SI.
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button, ButtonLink, Card } from '@/components/ui/primitives';
import { TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { shelterDefaultsFor } from '@/lib/defaults';
import { hasShelterAir, SHELTER_KIND_HINT, SHELTER_KIND_LABEL, SHELTER_KINDS, shelterSchema, type ShelterKind } from '@/lib/validation/airfields';
import type { ShelterRow } from '@/lib/views/airfields';
import { formatNumber } from './format';
import { issuesByField } from './issues';
import { ShelterKindIcon } from './ShelterKindIcon';

interface Props {
  mode: 'create' | 'edit';
  airfieldId: number;
  airfieldName: string;
  shelter?: ShelterRow;
}

type Thermal = { heatCapacityMJ: string; lossW: string; apertureM2: string; setpointC: string; heatingPowerKW: string };

const str = (v: number | null | undefined, scale = 1) => (v === null || v === undefined ? '' : String(Math.round((v / scale) * 1000) / 1000));

function presetStrings(kind: ShelterKind): Thermal {
  const d = shelterDefaultsFor(kind);
  return {
    heatCapacityMJ: str(d.heatCapacityJPerK, 1e6),
    lossW: str(d.lossWPerK),
    apertureM2: str(d.solarApertureM2),
    setpointC: str(d.setpointC),
    heatingPowerKW: str(d.heatingPowerW, 1e3),
  };
}

/** A form string in a display unit to the SI value the API takes; text that is not a number is passed on for the schema to name. */
function si(s: string, scale = 1): number | string {
  const t = s.trim().replace(/\u2212/g, '-').replace(',', '.');
  if (t === '') return '';
  const v = Number(t);
  return Number.isFinite(v) ? v * scale : s;
}

const FIELD_OF: Record<string, keyof Thermal> = {
  heatCapacityJPerK: 'heatCapacityMJ',
  lossWPerK: 'lossW',
  solarApertureM2: 'apertureM2',
  setpointC: 'setpointC',
  heatingPowerW: 'heatingPowerKW',
};

export function ShelterForm({ mode, airfieldId, airfieldName, shelter }: Props) {
  const router = useRouter();
  const [name, setName] = useState(shelter?.name ?? '');
  const [kind, setKind] = useState<ShelterKind>(shelter?.kind ?? 't-hangar');
  const [thermal, setThermal] = useState<Thermal>(() =>
    shelter && hasShelterAir(shelter.kind)
      ? {
          heatCapacityMJ: str(shelter.heatCapacityJPerK, 1e6),
          lossW: str(shelter.lossWPerK),
          apertureM2: str(shelter.solarApertureM2),
          setpointC: str(shelter.setpointC),
          heatingPowerKW: str(shelter.heatingPowerW, 1e3),
        }
      : presetStrings(shelter?.kind ?? 't-hangar'),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);

  const air = hasShelterAir(kind);
  const heated = kind === 'heated-hangar';
  const setT = (k: keyof Thermal) => (e: React.ChangeEvent<HTMLInputElement>) => setThermal((t) => ({ ...t, [k]: e.target.value }));

  function chooseKind(k: ShelterKind) {
    setKind(k);
    setThermal(presetStrings(k));
    setStatus(hasShelterAir(k) ? `Thermal values set from the ${SHELTER_KIND_LABEL[k].toLowerCase()} preset.` : 'An open tie-down has no shelter air to describe.');
  }

  function body() {
    const b: Record<string, unknown> = { name, kind };
    if (air) {
      b.heatCapacityJPerK = si(thermal.heatCapacityMJ, 1e6);
      b.lossWPerK = si(thermal.lossW);
      b.solarApertureM2 = si(thermal.apertureM2);
      if (heated) {
        b.setpointC = si(thermal.setpointC);
        b.heatingPowerW = si(thermal.heatingPowerKW, 1e3);
      }
    }
    return b;
  }

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const b = body();
    const checked = shelterSchema.safeParse(b);
    const show = (fields: Record<string, string>, message: string) => {
      const mapped: Record<string, string> = {};
      for (const [k, v] of Object.entries(fields)) mapped[FIELD_OF[k] ?? k] = v;
      setErrors(mapped);
      setStatus(message);
    };
    if (!checked.success) {
      const f = issuesByField(checked.error.issues);
      show(f, `Please correct ${Object.keys(f).length === 1 ? 'the field' : `${Object.keys(f).length} fields`} marked below.`);
      return;
    }
    setPending(true);
    setStatus('Saving…');
    const r =
      mode === 'create'
        ? await sendJson<{ shelter: ShelterRow }>(`/api/airfields/${airfieldId}/shelters`, 'POST', b)
        : await sendJson<{ shelter: ShelterRow }>(`/api/airfields/${airfieldId}/shelters/${shelter!.id}`, 'PATCH', b);
    setPending(false);
    if (!r.ok) {
      show(r.fields, r.message);
      return;
    }
    setErrors({});
    setStatus(mode === 'create' ? `${r.data.shelter.name} is added.` : 'Saved.');
    router.push(`/airfields/${airfieldId}`);
    router.refresh();
  }

  // What the numbers mean, for people who think in hours and degrees.
  const C = Number(si(thermal.heatCapacityMJ, 1e6));
  const G = Number(si(thermal.lossW));
  const P = Number(si(thermal.heatingPowerKW, 1e3));
  const S = Number(si(thermal.setpointC));
  const tauH = C > 0 && G > 0 ? C / G / 3600 : null;
  const holdsDownTo = heated && G > 0 && P > 0 && Number.isFinite(S) ? S - P / G : null;

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <Card aria-labelledby="sh-what-h" className="space-y-4">
        <h2 id="sh-what-h" className="text-base font-semibold text-slate-900 dark:text-white">The shelter at {airfieldName}</h2>
        <TextField id="sh-name" name="name" label="Name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} autoComplete="off" hint="As people call it on the field, e.g. “T-hangar row B”." />
        <fieldset aria-describedby={errors.kind ? 'sh-kind-error' : undefined}>
          <legend className="mb-1.5 text-sm font-medium text-slate-800 dark:text-slate-200">Kind</legend>
          <div className="grid gap-2 sm:grid-cols-2">
            {SHELTER_KINDS.map((k) => (
              <label
                key={k}
                className={`flex min-h-16 cursor-pointer gap-3 rounded-xl border p-3 transition has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-ice-400 ${
                  kind === k
                    ? 'border-ice-500 bg-ice-50 ring-2 ring-ice-300 dark:border-ice-400 dark:bg-ice-950 dark:ring-ice-800'
                    : 'border-slate-200 hover:border-slate-300 dark:border-slate-700 dark:hover:border-slate-600'
                }`}
              >
                <input type="radio" name="kind" value={k} checked={kind === k} onChange={() => chooseKind(k)} className="sr-only" />
                <ShelterKindIcon kind={k} className="mt-0.5 h-6 w-6 shrink-0" />
                <span>
                  <span className="block text-sm font-semibold text-slate-900 dark:text-white">{SHELTER_KIND_LABEL[k]}</span>
                  <span className="block text-xs text-slate-600 dark:text-slate-400">{SHELTER_KIND_HINT[k]}</span>
                </span>
              </label>
            ))}
          </div>
          {errors.kind ? <p id="sh-kind-error" className="mt-1 text-sm font-medium text-red-700 dark:text-red-300">{errors.kind}</p> : null}
        </fieldset>
      </Card>

      <Card aria-labelledby="sh-thermal-h" className="space-y-4">
        <div className="flex flex-wrap items-start justify-between gap-2">
          <div>
            <h2 id="sh-thermal-h" className="text-base font-semibold text-slate-900 dark:text-white">Thermal behaviour</h2>
            <p className="text-sm text-slate-600 dark:text-slate-400">{air ? 'Prefilled from the kind’s preset; change them if you know better.' : 'None to set.'}</p>
          </div>
          {air ? (
            <Button type="button" variant="secondary" className="min-h-10 px-3" onClick={() => chooseKind(kind)}>
              Use preset values
            </Button>
          ) : null}
        </div>
        {air ? (
          <>
            <div className="grid gap-4 sm:grid-cols-2">
              <TextField id="sh-c" label="Heat capacity (MJ/K)" inputMode="decimal" value={thermal.heatCapacityMJ} onChange={setT('heatCapacityMJ')} error={errors.heatCapacityMJ} hint="Air plus the floor and structure that warm and cool with it." />
              <TextField id="sh-g" label="Heat loss (W/K)" inputMode="decimal" value={thermal.lossW} onChange={setT('lossW')} error={errors.lossW} hint="Through walls, roof and door gaps, per kelvin inside–outside." />
              <TextField id="sh-a" label="Solar aperture (m²)" inputMode="decimal" value={thermal.apertureM2} onChange={setT('apertureM2')} error={errors.apertureM2} hint="Roof area × absorptance that warms the air in sunshine." />
            </div>
            {heated ? (
              <div className="grid gap-4 rounded-xl border border-ember-200 bg-ember-50/60 p-3 dark:border-ember-900 dark:bg-ember-950/20 sm:grid-cols-2">
                <TextField id="sh-set" label="Set-point (°C)" inputMode="decimal" value={thermal.setpointC} onChange={setT('setpointC')} error={errors.setpointC} />
                <TextField id="sh-p" label="Heating power (kW)" inputMode="decimal" value={thermal.heatingPowerKW} onChange={setT('heatingPowerKW')} error={errors.heatingPowerKW} />
              </div>
            ) : null}
            <dl className="grid gap-2 rounded-xl bg-slate-50 p-3 text-sm dark:bg-slate-800/50 sm:grid-cols-2" aria-live="polite">
              <div>
                <dt className="text-xs font-medium uppercase tracking-wide text-slate-500">Time constant</dt>
                <dd className="font-semibold tabular-nums text-slate-900 dark:text-white">{tauH === null ? '—' : `${formatNumber(tauH)} h`}</dd>
                <dd className="text-xs text-slate-500">The air closes about two thirds of a gap to the outside in this time.</dd>
              </div>
              {heated ? (
                <div>
                  <dt className="text-xs font-medium uppercase tracking-wide text-slate-500">Holds the set-point down to</dt>
                  <dd className="font-semibold tabular-nums text-slate-900 dark:text-white">{holdsDownTo === null ? '—' : `${formatNumber(holdsDownTo)} °C outside`}</dd>
                  <dd className="text-xs text-slate-500">Set-point − power ÷ heat loss, without sun.</dd>
                </div>
              ) : null}
            </dl>
          </>
        ) : (
          <p className="rounded-xl bg-slate-50 p-3 text-sm text-slate-700 dark:bg-slate-800/50 dark:text-slate-300">
            Aircraft on a tie-down sit in the outside air; the wind speeds their cooling and frost can form on the airframe on clear nights.
          </p>
        )}
      </Card>

      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:items-center lg:col-span-2">
        <ButtonLink href={`/airfields/${airfieldId}`} variant="secondary">Cancel</ButtonLink>
        <Button type="submit" disabled={pending} className="sm:min-w-44">
          {pending ? 'Saving…' : mode === 'create' ? 'Add shelter' : 'Save changes'}
        </Button>
        <p role="status" aria-live="polite" className={`text-sm ${Object.keys(errors).length ? 'font-medium text-red-700 dark:text-red-300' : 'text-slate-600 dark:text-slate-400'}`}>
          {status}
        </p>
      </div>
    </form>
  );
}
