'use client';
// Create or edit an airfield. The shared zod schema checks the form before it is sent (the server
// checks again); errors show beside their fields, the input is kept, the result is announced.
import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { Button, ButtonLink, Card } from '@/components/ui/primitives';
import { SelectField, TextField, inputClass } from '@/components/ui/Field';
import { LocationPickerLazy } from '@/components/map/SiteMapLazy';
import type { Landmark } from '@/components/map/LocationPicker';
import { sendJson } from '@/lib/client/fetcher';
import { canonicalTimeZone, formatTime, formatUtcOffset } from '@/lib/time';
import { airfieldCreateSchema, airfieldUpdateSchema, SHELTER_KIND_LABEL, SHELTER_KINDS, type ShelterKind } from '@/lib/validation/airfields';
import type { AirfieldRow } from '@/lib/views/airfields';
import { issuesByField } from './issues';

interface Props {
  mode: 'create' | 'edit';
  airfield?: AirfieldRow;
  timeZones: string[];
  defaultTimeZone: string;
  tileUrl: string;
  tileAttribution: string;
  fallbackCenter?: [number, number];
  landmarks?: Landmark[];
}

interface ShelterDraft {
  key: number;
  name: string;
  kind: ShelterKind;
}

const num = (s: string): number | null => {
  const v = Number(s.trim().replace(/\u2212/g, '-').replace(',', '.'));
  return s.trim() !== '' && Number.isFinite(v) ? v : null;
};

export function AirfieldForm({ mode, airfield, timeZones, defaultTimeZone, tileUrl, tileAttribution, fallbackCenter, landmarks = [] }: Props) {
  const router = useRouter();
  const [form, setForm] = useState({
    name: airfield?.name ?? '',
    ident: airfield?.ident ?? '',
    latitude: airfield ? String(airfield.latitude) : '',
    longitude: airfield ? String(airfield.longitude) : '',
    elevationM: airfield ? String(airfield.elevationM) : '',
    timeZone: airfield?.timeZone ?? defaultTimeZone,
  });
  const [shelters, setShelters] = useState<ShelterDraft[]>([]);
  const [nextKey, setNextKey] = useState(1);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);

  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) => setForm((f) => ({ ...f, [k]: e.target.value }));
  const zone = canonicalTimeZone(form.timeZone);
  const zoneHint = useMemo(() => {
    if (!zone) return 'An IANA zone name, such as Europe/Helsinki. Every time for this airfield is shown in it.';
    const now = Date.now();
    return `Local time there now: ${formatTime(now, zone)} (${formatUtcOffset(zone, now)}). Every time for this airfield is shown in it.`;
  }, [zone]);

  function values() {
    const base = { ...form };
    return mode === 'create' ? { ...base, shelters: shelters.map(({ name, kind }) => ({ name, kind })) } : base;
  }

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const body = values();
    const schema = mode === 'create' ? airfieldCreateSchema : airfieldUpdateSchema;
    const checked = schema.safeParse(body);
    if (!checked.success) {
      const fields = issuesByField(checked.error.issues);
      setErrors(fields);
      setStatus(`Please correct ${Object.keys(fields).length === 1 ? 'the field' : `${Object.keys(fields).length} fields`} marked below.`);
      return;
    }
    setPending(true);
    setStatus(mode === 'create' ? 'Creating the airfield…' : 'Saving…');
    const r = mode === 'create' ? await sendJson<{ airfield: AirfieldRow }>('/api/airfields', 'POST', body) : await sendJson<{ airfield: AirfieldRow }>(`/api/airfields/${airfield!.id}`, 'PATCH', body);
    setPending(false);
    if (!r.ok) {
      setErrors(r.fields);
      setStatus(r.message);
      return;
    }
    setErrors({});
    setStatus(mode === 'create' ? `${r.data.airfield.name} is created.` : 'Saved.');
    router.push(`/airfields/${r.data.airfield.id}`);
    router.refresh();
  }

  const lat = num(form.latitude);
  const lon = num(form.longitude);

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]" aria-describedby="airfield-form-status">
      <Card aria-labelledby="af-id-h" className="space-y-4">
        <h2 id="af-id-h" className="text-base font-semibold text-slate-900 dark:text-white">The airfield</h2>
        <TextField id="af-name" name="name" label="Name" value={form.name} onChange={set('name')} error={errors.name} maxLength={200} autoComplete="off" />
        <TextField
          id="af-ident"
          name="ident"
          label="Identifier"
          value={form.ident}
          onChange={set('ident')}
          error={errors.ident}
          hint="Your own short code for the field, 2–8 letters or digits."
          autoCapitalize="characters"
          autoComplete="off"
          className={`${inputClass} uppercase tracking-wider`}
        />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField id="af-elevation" name="elevationM" label="Elevation (m)" inputMode="decimal" value={form.elevationM} onChange={set('elevationM')} error={errors.elevationM} hint="Above mean sea level." />
          <TextField id="af-zone" name="timeZone" label="Time zone" list="af-zones" value={form.timeZone} onChange={set('timeZone')} error={errors.timeZone} hint={zoneHint} autoComplete="off" spellCheck={false} />
        </div>
        <datalist id="af-zones">
          {timeZones.map((z) => (
            <option key={z} value={z} />
          ))}
        </datalist>
      </Card>

      <Card aria-labelledby="af-pos-h" className="space-y-4">
        <h2 id="af-pos-h" className="text-base font-semibold text-slate-900 dark:text-white">Position</h2>
        <div className="grid grid-cols-2 gap-4">
          <TextField id="af-lat" name="latitude" label="Latitude (°)" inputMode="decimal" value={form.latitude} onChange={(e) => {
            // "61.52, 24.07" pasted or typed into Latitude fills both boxes.
            const m = /^\s*(-?\d+(?:\.\d+)?)\s*[,;\s]\s*(-?\d+(?:\.\d+)?)\s*$/.exec(e.target.value.replace(/\u2212/g, '-'));
            if (m) setForm((f) => ({ ...f, latitude: m[1], longitude: m[2] }));
            else set('latitude')(e);
          }} error={errors.latitude} hint="North positive, −90 to 90." />
          <TextField id="af-lon" name="longitude" label="Longitude (°)" inputMode="decimal" value={form.longitude} onChange={set('longitude')} error={errors.longitude} hint="East positive, −180 to 180." />
        </div>
        <div>
          <p className="mb-1.5 text-sm font-medium text-slate-800 dark:text-slate-200" id="af-pick-label">Or pick it on the map</p>
          <div className="overflow-hidden rounded-xl border border-slate-200 dark:border-slate-700" aria-labelledby="af-pick-label">
            <LocationPickerLazy
              latitude={lat}
              longitude={lon}
              onPick={(la, lo) => setForm((f) => ({ ...f, latitude: String(la), longitude: String(lo) }))}
              tileUrl={tileUrl}
              tileAttribution={tileAttribution}
              fallbackCenter={fallbackCenter}
              landmarks={landmarks.filter((l) => l.id !== airfield?.id)}
            />
          </div>
          <p className="mt-1.5 text-xs text-slate-500 dark:text-slate-400">
            Tap or click to place the crosshair; drag it to adjust. Your other airfields are named on the map. You can also paste “latitude, longitude” into the Latitude box.
          </p>
        </div>
      </Card>

      {mode === 'create' ? (
        <Card aria-labelledby="af-sh-h" className="space-y-4 lg:col-span-2">
          <div className="flex flex-wrap items-end justify-between gap-2">
            <div>
              <h2 id="af-sh-h" className="text-base font-semibold text-slate-900 dark:text-white">First shelters <span className="font-normal text-slate-500">(optional)</span></h2>
              <p className="text-sm text-slate-600 dark:text-slate-400">Created together with the airfield. Thermal values start from each kind&rsquo;s preset; fine-tune them later.</p>
            </div>
            <Button
              type="button"
              variant="secondary"
              onClick={() => {
                setShelters((s) => [...s, { key: nextKey, name: '', kind: 't-hangar' }]);
                setNextKey((k) => k + 1);
              }}
            >
              + Add a shelter
            </Button>
          </div>
          {shelters.length ? (
            <ol className="space-y-3">
              {shelters.map((s, i) => (
                <li key={s.key} className="grid items-start gap-3 rounded-xl border border-slate-200 p-3 dark:border-slate-800 sm:grid-cols-[1fr_14rem_auto]">
                  <TextField
                    id={`af-sh-${s.key}-name`}
                    label={`Shelter ${i + 1} name`}
                    value={s.name}
                    onChange={(e) => setShelters((all) => all.map((x) => (x.key === s.key ? { ...x, name: e.target.value } : x)))}
                    error={errors[`shelters.${i}.name`]}
                    autoComplete="off"
                  />
                  <SelectField
                    id={`af-sh-${s.key}-kind`}
                    label={`Shelter ${i + 1} kind`}
                    value={s.kind}
                    onChange={(e) => setShelters((all) => all.map((x) => (x.key === s.key ? { ...x, kind: e.target.value as ShelterKind } : x)))}
                    error={errors[`shelters.${i}.kind`]}
                  >
                    {SHELTER_KINDS.map((k) => (
                      <option key={k} value={k}>{SHELTER_KIND_LABEL[k]}</option>
                    ))}
                  </SelectField>
                  <Button type="button" variant="ghost" className="sm:mt-6" onClick={() => setShelters((all) => all.filter((x) => x.key !== s.key))}>
                    Remove<span className="sr-only"> shelter {i + 1}</span>
                  </Button>
                </li>
              ))}
            </ol>
          ) : (
            <p className="rounded-xl border border-dashed border-slate-300 px-4 py-3 text-sm text-slate-500 dark:border-slate-700">No shelters yet: you can also add them on the airfield&rsquo;s page.</p>
          )}
          {errors.shelters ? <p className="text-sm font-medium text-red-700 dark:text-red-300">{errors.shelters}</p> : null}
        </Card>
      ) : null}

      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:items-center lg:col-span-2">
        <ButtonLink href={airfield ? `/airfields/${airfield.id}` : '/airfields'} variant="secondary">Cancel</ButtonLink>
        <Button type="submit" disabled={pending} aria-disabled={pending} className="sm:min-w-44">
          {pending ? (mode === 'create' ? 'Creating…' : 'Saving…') : mode === 'create' ? 'Create airfield' : 'Save changes'}
        </Button>
        <p id="airfield-form-status" role="status" aria-live="polite" className={`text-sm ${Object.keys(errors).length ? 'font-medium text-red-700 dark:text-red-300' : 'text-slate-600 dark:text-slate-400'}`}>
          {status}
        </p>
      </div>
    </form>
  );
}
