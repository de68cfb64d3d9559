'use client';
// One submit path for the Oil log's forms: pending state, field errors by name, a status line.
import { useState } from 'react';
import { sendJson } from '@/lib/client/fetcher';

export function useSubmit() {
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  async function submit<T>(url: string, method: 'POST' | 'PATCH', body: unknown, okMessage: string, onOk: (data: T) => void) {
    setPending(true);
    setStatus('');
    const r = await sendJson<T>(url, method, body);
    setPending(false);
    if (r.ok) {
      setFields({});
      setStatus(okMessage);
      onOk(r.data);
    } else {
      setFields(r.fields);
      setStatus(r.message);
    }
  }
  return { fields, status, pending, submit };
}
