'use client';
// The aircraft's thermal profile now and every earlier one: what each came from, who applied it, and a
// way back to any of them (restoring is itself recorded, so it can be undone too).
import { useState } from 'react';
import { Button, Card, Notice } from '@/components/ui/primitives';
import { sendJson } from '@/lib/client/fetcher';
import { formatDateTime } from '@/lib/time';
import type { RevisionRecord } from '@/lib/views/logs';
import type { ThermalParams } from '@/lib/views/aircraft';
import { profileTauH, SOURCE_LABEL, thermalLine } from './format';

export interface Profile {
  thermal: ThermalParams;
  revisions: RevisionRecord[];
}

const KIND_LABEL: Record<RevisionRecord['kind'], string> = {
  initial: 'Before the first change',
  fitted: 'Fitted from a log',
  revert: 'Restored',
  manual: 'Entered by hand',
};

export function ProfileHistory({ aircraftId, registration, profile, onChanged, zone = 'UTC' }: { aircraftId: number; registration: string; profile: Profile; onChanged: () => void; zone?: string }) {
  const [pending, setPending] = useState<number | null>(null);
  const [status, setStatus] = useState('');
  const [error, setError] = useState('');
  const t = profile.thermal;

  async function restore(r: RevisionRecord) {
    setPending(r.id);
    setError('');
    const res = await sendJson(`/api/aircraft/${aircraftId}/profile/revert`, 'POST', { revisionId: r.id });
    setPending(null);
    if (res.ok) {
      setStatus(`Restored the profile of ${formatDateTime(Date.parse(r.createdAt), zone)}.`);
      onChanged();
    } else setError(res.message);
  }

  return (
    <Card aria-labelledby="profile-h">
      <h2 id="profile-h" className="text-lg font-semibold">Profile of {registration}</h2>
      <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">
        {t.nodes.length === 2 ? 'Two nodes' : 'One node'}, {SOURCE_LABEL[t.source]}; overall τ ≈ {profileTauH(t).toFixed(1)} h uncovered, cover factor {t.coverFactor}.
      </p>
      <p className="mt-1 text-sm font-medium text-slate-800 dark:text-slate-200">{thermalLine(t)}</p>
      <div aria-live="polite" className="mt-2 space-y-2">
        {status ? (
          <p role="status" className="text-sm text-slate-700 dark:text-slate-300">
            {status}
          </p>
        ) : null}
        {error ? <Notice tone="danger">{error}</Notice> : null}
      </div>
      <h3 className="mt-4 text-sm font-semibold uppercase tracking-wide text-slate-500 dark:text-slate-400">History</h3>
      {profile.revisions.length ? (
        <ol className="mt-2 space-y-3">
          {profile.revisions.map((r) => {
            const s = r.summary as { model?: string; tauH?: number; tauSlowH?: number; rmseK?: number; fileName?: string } | null;
            return (
              <li key={r.id} className={`rounded-xl border p-3 text-sm ${r.current ? 'border-ice-300 bg-ice-50 dark:border-ice-700 dark:bg-ice-950' : 'border-slate-200 dark:border-slate-800'}`}>
                <div className="flex items-start justify-between gap-2">
                  <div className="min-w-0">
                    <p className="font-semibold text-slate-900 dark:text-white">
                      {KIND_LABEL[r.kind]}
                      {r.current ? <span className="ml-2 rounded-full bg-ice-700 px-2 py-0.5 text-xs font-semibold text-white dark:bg-ice-400 dark:text-slate-950">Current</span> : null}
                    </p>
                    <p className="text-xs text-slate-600 dark:text-slate-400">
                      {formatDateTime(Date.parse(r.createdAt), zone)}
                      {r.author ? ` · ${r.author.name}` : ''}
                    </p>
                  </div>
                  {!r.current ? (
                    <Button variant="secondary" className="min-h-10 shrink-0 px-3" onClick={() => restore(r)} disabled={pending !== null}>
                      {pending === r.id ? 'Restoring…' : 'Restore'}
                      <span className="sr-only"> the profile of {formatDateTime(Date.parse(r.createdAt), zone)}</span>
                    </Button>
                  ) : null}
                </div>
                <p className="mt-1 text-slate-700 dark:text-slate-300">{thermalLine(r.thermal)}</p>
                {s?.model ? (
                  <p className="mt-1 text-xs text-slate-500 dark:text-slate-400">
                    {s.model === 'two-node' ? `Two nodes, slow τ ${s.tauSlowH?.toFixed(2)} h` : `One node, τ ${s.tauH?.toFixed(2)} h`}
                    {s.rmseK !== undefined ? `, RMSE ${s.rmseK.toFixed(2)} K` : ''}
                    {s.fileName ? ` · ${s.fileName}` : ''}
                  </p>
                ) : null}
                {r.note ? <p className="mt-1 text-xs italic text-slate-500 dark:text-slate-400">{r.note}</p> : null}
              </li>
            );
          })}
        </ol>
      ) : (
        <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">No changes recorded yet. Applying a fit keeps the present profile here first, so there is always a way back.</p>
      )}
    </Card>
  );
}
