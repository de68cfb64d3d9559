import { pageUser } from '@/lib/auth/page';

// The Season report is for the roles that run the plans (managers and operators): it judges the plans.
// Pilots record their own mornings on the Departures page. The check sits above any loading boundary.
export default async function Layout({ children }: { children: React.ReactNode }) {
  await pageUser('plans:manage');
  return children;
}
