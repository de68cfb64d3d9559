import { pageUser } from '@/lib/auth/page';

// Managers only: the check sits in the segment layout, above any loading boundary, so a refusal answers 403.
export default async function Layout({ children }: { children: React.ReactNode }) {
  await pageUser('airfields:edit');
  return children;
}
