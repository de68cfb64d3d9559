'use client';
// Remove an airfield or a shelter, with a confirmation step. What happens is said before it does:
// with aircraft homed there it is archived (history kept), otherwise deleted.
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/primitives';
import { sendJson } from '@/lib/client/fetcher';

interface Props {
  url: string;
  name: string;
  /** Aircraft homed there: archive instead of delete. */
  aircraftCount: number;
  /** Where to go after removing; default: stay and refresh. */
  redirectTo?: string;
  compact?: boolean;
}

export function RemoveButton({ url, name, aircraftCount, redirectTo, compact = false }: Props) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [pending, setPending] = useState(false);
  const [status, setStatus] = useState('');
  const archive = aircraftCount > 0;
  const verb = archive ? 'Archive' : 'Delete';

  async function go() {
    setPending(true);
    const r = await sendJson<{ result: 'archived' | 'deleted' }>(url, 'DELETE');
    setPending(false);
    setConfirming(false);
    if (!r.ok) {
      setStatus(r.message);
      return;
    }
    setStatus(r.data.result === 'archived' ? `${name} is archived.` : `${name} is deleted.`);
    if (redirectTo) router.push(redirectTo);
    router.refresh();
  }

  return (
    <span className={`inline-flex flex-wrap items-center gap-2 ${compact ? '' : 'w-full'}`}>
      {confirming ? (
        <span role="group" aria-label={`${verb} ${name}?`} className="inline-flex flex-wrap items-center gap-2">
          <span className="text-sm text-slate-700 dark:text-slate-300">
            {archive ? `${aircraftCount} aircraft ${aircraftCount === 1 ? 'is' : 'are'} homed here: it will be archived, not deleted.` : 'This cannot be undone.'}
          </span>
          <Button variant="danger" className="min-h-10 px-3" onClick={go} disabled={pending}>
            {pending ? `${verb === 'Archive' ? 'Archiving' : 'Deleting'}…` : `${verb} ${compact ? '' : name}`.trim()}
            {compact ? <span className="sr-only"> {name}</span> : null}
          </Button>
          <Button variant="ghost" className="min-h-10 px-3" onClick={() => setConfirming(false)}>
            Keep
          </Button>
        </span>
      ) : (
        <Button variant={compact ? 'ghost' : 'danger'} className={compact ? 'min-h-10 px-3 text-red-700 dark:text-red-300' : ''} onClick={() => setConfirming(true)}>
          {verb}
          {compact ? <span className="sr-only"> {name}</span> : ` ${name}`}
        </Button>
      )}
      <span role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">{status}</span>
    </span>
  );
}
