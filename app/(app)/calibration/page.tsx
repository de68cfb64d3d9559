import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { CalibrationView, type CalibrationAircraft } from '@/components/fit/CalibrationView';
import { pageUser } from '@/lib/auth/page';
import { listAircraft } from '@/lib/data/aircraft';
import { capacitiesFor, getProfile, listLogs, zoneOf } from '@/lib/data/logs';

export const metadata: Metadata = { title: 'Fit from log' };

export default async function Page({ searchParams }: { searchParams: Promise<{ aircraft?: string }> }) {
  const user = await pageUser('aircraft:edit');
  const { aircraft: wanted } = await searchParams;
  const fleet = await listAircraft({ orgId: user.orgId });
  const selected = fleet.find((a) => String(a.id) === wanted) ?? fleet[0] ?? null;
  const [logs, profile] = selected
    ? await Promise.all([listLogs({ orgId: user.orgId, aircraftId: selected.id }), getProfile({ orgId: user.orgId, aircraftId: selected.id })])
    : [[], null];
  const aircraft: CalibrationAircraft[] = fleet.map((a) => ({
    id: a.id,
    registration: a.registration,
    typeLabel: a.typeLabel,
    engineClassLabel: a.engineClassLabel,
    timeZone: zoneOf(a),
    thermal: a.thermal,
    coverOnByDefault: a.coverOnByDefault,
    archived: a.archived,
    capacity: (({ total, oilShare }) => ({ total, oilShare }))(capacitiesFor(a)),
  }));
  return (
    <>
      <PageHeader title="Fit from log" subtitle="Calibrate an aircraft's cooling from a logged cool-down: upload, check the fit, apply it to the profile." />
      <CalibrationView
        aircraft={aircraft}
        selectedId={selected?.id ?? null}
        initialLogs={logs}
        initialProfile={profile ? { thermal: profile.thermal, revisions: profile.revisions } : null}
        tempUnit={user.tempUnit}
      />
    </>
  );
}
