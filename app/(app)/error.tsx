'use client';
import { Button } from '@/components/ui/primitives';

export default function SectionError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="mx-auto max-w-md py-16 text-center">
      <h1 className="text-xl font-semibold text-slate-900 dark:text-white">This page could not load</h1>
      <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">Nothing you entered was lost. Try again; if it keeps failing, the server log has the details.</p>
      <Button className="mt-6" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
