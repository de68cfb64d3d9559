'use client';
// Small pieces the board and the plan detail share (kept apart so neither imports the other).
import { useState } from 'react';
import { Button } from '@/components/ui/primitives';
import { sendJson } from '@/lib/client/fetcher';

export function money(v: number | null, currency: string) {
  if (v === null) return '—';
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 2 }).format(v);
}

export function pct(p: number | null) {
  return p === null ? '—' : `${Math.round(p * 100)} %`;
}

export function ConfirmButton({ departureId, onDone }: { departureId: number; onDone: () => void }) {
  const [state, setState] = useState<'idle' | 'busy' | 'done' | 'failed'>('idle');
  return (
    <Button
      variant="secondary"
      disabled={state === 'busy'}
      onClick={async () => {
        setState('busy');
        // A lost connection is a failure to retry, never a button left busy.
        const r = await sendJson(`/api/departures/${departureId}/plan/confirm`, 'POST');
        setState(r.ok ? 'done' : 'failed');
        onDone();
      }}
    >
      {state === 'done' ? 'Confirmed' : state === 'failed' ? 'Could not confirm — retry' : 'Confirm heat plan'}
    </Button>
  );
}
