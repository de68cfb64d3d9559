import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { MailViewer } from '@/components/mail/MailViewer';
import { pageUser } from '@/lib/auth/page';
import { idParam } from '@/lib/api/route';
import { NotFound } from '@/lib/api/errors';
import { getCapturedMail, mailViewerData } from '@/lib/data/mail';

export const metadata: Metadata = { title: 'Local mail capture' };
export const dynamic = 'force-dynamic';

export default async function MailMessagePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('mail:view');
  const id = idParam(await params);
  const message = await getCapturedMail({ orgId: user.orgId, id, viewerEmail: user.email }).catch((e) => {
    if (e instanceof NotFound) notFound();
    throw e;
  });
  return <MailViewer initial={await mailViewerData({ orgId: user.orgId })} selected={message} />;
}
