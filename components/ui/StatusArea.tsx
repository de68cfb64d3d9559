import { Notice } from '@/components/ui/primitives';

/** The live region under an action: what happened, or what went wrong. */
export function StatusArea({ status, error }: { status: string; error: string }) {
  return (
    <div className="mt-3 space-y-2" aria-live="polite">
      {status ? (
        <p role="status" className="text-sm text-slate-700 dark:text-slate-300">
          {status}
        </p>
      ) : null}
      {error ? (
        <Notice tone="danger" title="That did not work">
          {error}
        </Notice>
      ) : null}
    </div>
  );
}
