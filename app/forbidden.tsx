import Link from 'next/link';
import { buttonClass } from '@/components/ui/primitives';

export default function Forbidden() {
  return (
    <div className="mx-auto flex min-h-[60dvh] max-w-md flex-col items-center justify-center px-4 text-center">
      <p className="text-sm font-semibold uppercase tracking-wider text-ice-700 dark:text-ice-300">403 · Not for your role</p>
      <h1 className="mt-2 text-2xl font-semibold text-slate-900 dark:text-white">This page is not open to you</h1>
      <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">Ask a manager of your organization if you need access.</p>
      <Link href="/" className={buttonClass('primary', 'mt-6')}>
        Back to my start page
      </Link>
    </div>
  );
}
