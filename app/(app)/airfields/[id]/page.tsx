import type { Metadata } from 'next';
import { ButtonLink, Card, Notice, PageHeader } from '@/components/ui/primitives';
import { AirfieldOutlook } from '@/components/airfields/AirfieldOutlook';
import { RemoveButton } from '@/components/airfields/RemoveButton';
import { RestoreAirfield } from '@/components/airfields/RestoreAirfield';
import { formatLatLon, formatNumber } from '@/components/airfields/format';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { forecastView, pageRefreshMode } from '@/lib/data/forecasts';
import { formatUtcOffset } from '@/lib/time';
import { airfieldOr404 } from '../load';

export const metadata: Metadata = { title: 'Airfield' };

export default async function Page({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('org:read');
  const airfield = await airfieldOr404(user.orgId, (await params).id);
  const now = new Date();
  const view = await forecastView({ orgId: user.orgId, airfieldId: airfield.id, shelters: airfield.shelters, now, refresh: pageRefreshMode() });
  const canEdit = can(user.role, 'airfields:edit');
  return (
    <>
      <PageHeader
        title={airfield.name}
        subtitle={
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <span className="rounded-md bg-slate-200 px-1.5 py-0.5 text-xs font-semibold tracking-wider text-slate-700 dark:bg-slate-800 dark:text-slate-200">{airfield.ident}</span>
            <span>{formatLatLon(airfield.latitude, airfield.longitude)}</span>
            <span>{formatNumber(airfield.elevationM, 0)} m</span>
            <span>
              {airfield.timeZone} ({formatUtcOffset(airfield.timeZone, now.getTime())})
            </span>
          </span>
        }
        actions={
          <>
            <ButtonLink href={`/airfields/${airfield.id}/tariff`} variant="secondary">Electricity tariff</ButtonLink>
            {canEdit ? (
              <>
                <ButtonLink href={`/airfields/${airfield.id}/edit`} variant="secondary">Edit airfield</ButtonLink>
                <ButtonLink href={`/airfields/${airfield.id}/shelters/new`}>Add shelter</ButtonLink>
              </>
            ) : null}
          </>
        }
      />
      {airfield.archived ? (
        <div className="mb-5">
          <Notice tone="caution" title="This airfield is archived">
            It is kept because aircraft are homed in its shelters; it no longer shows on the Site map.
            {canEdit ? <RestoreAirfield id={airfield.id} name={airfield.name} /> : null}
          </Notice>
        </div>
      ) : null}
      <AirfieldOutlook airfield={airfield} initial={view} unit={user.tempUnit} canEdit={canEdit} />
      {canEdit && !airfield.archived ? (
        <Card aria-labelledby="remove-h" className="mt-5 border-dashed">
          <h2 id="remove-h" className="text-base font-semibold text-slate-900 dark:text-white">Remove this airfield</h2>
          <p className="mb-3 mt-1 text-sm text-slate-600 dark:text-slate-400">
            {airfield.aircraftCount > 0
              ? 'Aircraft are homed in its shelters, so it will be archived: kept with its history, hidden from the map and lists.'
              : 'No aircraft are homed here: it will be deleted with its shelters and its cached forecast.'}
          </p>
          <RemoveButton url={`/api/airfields/${airfield.id}`} name={airfield.name} aircraftCount={airfield.aircraftCount} redirectTo="/airfields" />
        </Card>
      ) : null}
    </>
  );
}
