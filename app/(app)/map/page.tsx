import type { Metadata } from 'next';
import { ButtonLink, EmptyState, PageHeader } from '@/components/ui/primitives';
import { SiteMapView } from '@/components/map/SiteMapView';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { listAirfields } from '@/lib/data/airfields';
import { pageRefreshMode, tonightForAirfields } from '@/lib/data/forecasts';
import { readinessByAirfield } from '@/lib/data/plans';
import { env } from '@/lib/env';

export const metadata: Metadata = { title: 'Site map' };

export default async function Page() {
  const user = await pageUser('org:read');
  const airfields = await listAirfields({ orgId: user.orgId });
  // First paint from the cache (refreshed here only when that is cheap); the client refreshes through the API.
  const weather = await tonightForAirfields({ orgId: user.orgId, airfieldIds: airfields.map((a) => a.id), now: new Date(), refresh: pageRefreshMode() });
  const ready = await readinessByAirfield({ orgId: user.orgId, refresh: pageRefreshMode() === 'never' ? 'never' : 'if-old' });
  const initial = airfields.map((a) => ({ ...a, ...weather.get(a.id), morning: ready.get(a.id) ?? null }));
  const e = env();
  const canEdit = can(user.role, 'airfields:edit');
  return (
    <>
      <PageHeader
        title="Site map"
        subtitle="Every airfield with tonight’s forecast low, edged by the worst readiness of its aircraft for the morning. Open a tag for its shelters."
        actions={canEdit ? <ButtonLink href="/airfields/new">Add airfield</ButtonLink> : null}
      />
      {airfields.length === 0 ? (
        <div className="mb-6">
          <EmptyState
            title="No airfields yet"
            action={canEdit ? <ButtonLink href="/airfields/new">Add the first airfield</ButtonLink> : null}
          >
            {canEdit ? 'Add an airfield and its shelters; it appears here with tonight’s forecast low.' : 'A manager of your organization adds airfields; they appear here.'}
          </EmptyState>
        </div>
      ) : null}
      <SiteMapView initial={initial} unit={user.tempUnit} tileUrl={e.MAP_TILE_URL} tileAttribution={e.MAP_TILE_ATTRIBUTION} />
    </>
  );
}
