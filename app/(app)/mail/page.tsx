import type { Metadata } from 'next';
import { MailViewer } from '@/components/mail/MailViewer';
import { pageUser } from '@/lib/auth/page';
import { mailViewerData } from '@/lib/data/mail';

export const metadata: Metadata = { title: 'Local mail capture' };
export const dynamic = 'force-dynamic';

export default async function MailPage() {
  const user = await pageUser('mail:view');
  return <MailViewer initial={await mailViewerData({ orgId: user.orgId })} selected={null} />;
}
