import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/primitives';
import { TariffEditor } from '@/components/tariffs/TariffEditor';
import { NotFound } from '@/lib/api/errors';
import { idParam } from '@/lib/api/route';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { getTariff, type TariffRecord } from '@/lib/data/tariffs';

export const metadata: Metadata = { title: 'Tariff' };

export default async function Page({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('org:read');
  const { id } = await params;
  let tariff: TariffRecord;
  try {
    tariff = await getTariff({ orgId: user.orgId, airfieldId: idParam({ id }) });
  } catch (e) {
    if (e instanceof NotFound) notFound();
    throw e;
  }
  const canEdit = can(user.role, 'airfields:edit');
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href={`/airfields/${tariff.airfieldId}`} className="text-ice-700 hover:underline dark:text-ice-300">
          {tariff.airfieldName}
        </Link>
      </nav>
      <PageHeader
        title="Electricity tariff"
        subtitle={`Time-of-use prices at ${tariff.airfieldName}: Heat plans put the heating in the cheapest hours that still warm the oil in time.`}
      />
      <TariffEditor initial={tariff} canEdit={canEdit} />
    </>
  );
}
