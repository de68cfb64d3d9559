import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { DevicesManager } from '@/components/devices/DevicesManager';
import { pageUser } from '@/lib/auth/page';
import { listDevices } from '@/lib/data/devices';
import { listAircraft, listShelterChoices } from '@/lib/data/aircraft';

export const metadata: Metadata = { title: 'Devices' };

export default async function DevicesPage() {
  const user = await pageUser('aircraft:edit');
  const [devices, aircraft, shelters] = await Promise.all([
    listDevices({ orgId: user.orgId }),
    listAircraft({ orgId: user.orgId }),
    listShelterChoices({ orgId: user.orgId }),
  ]);
  return (
    <>
      <PageHeader title="Devices" subtitle="Heater relays and temperature probes that talk to Thawline over MQTT." />
      <DevicesManager
        initial={devices}
        aircraft={aircraft.map((a) => ({ id: a.id, label: `${a.registration} · ${a.typeLabel}` }))}
        shelters={shelters.flatMap((f) => f.shelters.map((s) => ({ id: s.id, label: `${f.airfield.name} · ${s.name}` })))}
      />
    </>
  );
}
