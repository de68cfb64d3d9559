'use client';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/primitives';
import { sendJson } from '@/lib/client/fetcher';

export function RestoreAirfield({ id, name }: { id: number; name: string }) {
  const router = useRouter();
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  return (
    <div className="mt-3 flex flex-wrap items-center gap-3">
      <Button
        variant="secondary"
        disabled={pending}
        onClick={async () => {
          setPending(true);
          const r = await sendJson(`/api/airfields/${id}`, 'PATCH', { archived: false });
          setPending(false);
          setStatus(r.ok ? `${name} is restored.` : r.message);
          if (r.ok) router.refresh();
        }}
      >
        {pending ? 'Restoring…' : 'Restore airfield'}
      </Button>
      <span role="status" aria-live="polite" className="text-sm">{status}</span>
    </div>
  );
}
