import { pageUser } from '@/lib/auth/page';

// The role check sits in the segment's layout, above any loading boundary, so a refusal answers 403.
export default async function Layout({ children }: { children: React.ReactNode }) {
  await pageUser('mail:view');
  return children;
}
