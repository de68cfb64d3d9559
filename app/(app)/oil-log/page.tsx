import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { OilLogView } from '@/components/oil/OilLogView';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { getOilLog, listOilAircraft } from '@/lib/data/oil';

export const metadata: Metadata = { title: 'Oil log' };

export default async function Page({ searchParams }: { searchParams: Promise<{ aircraft?: string }> }) {
  const user = await pageUser('oil-log:write');
  const { aircraft: wanted } = await searchParams;
  const choices = await listOilAircraft({ orgId: user.orgId });
  const selected = choices.find((a) => String(a.id) === wanted) ?? choices[0] ?? null;
  const initial = selected ? await getOilLog({ orgId: user.orgId, aircraftId: selected.id }) : null;
  return (
    <>
      <PageHeader title="Oil log" subtitle="Cold oil checks and oil changes; levels corrected to 15 °C, oil used per engine hour, the next change." />
      <OilLogView
        choices={choices}
        selectedId={selected?.id ?? null}
        initial={initial}
        me={{ id: user.id, canEditAircraft: can(user.role, 'aircraft:edit'), tempUnit: user.tempUnit, volumeUnit: user.volumeUnit }}
      />
    </>
  );
}
