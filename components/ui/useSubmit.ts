'use client';
// One submit path for forms: pending state, field errors by name, a status line, and a retry of the
// same request when it failed on the way or on the server (no connection, 429, 5xx), not on the input.
import { useRef, useState } from 'react';
import { sendJson } from '@/lib/client/fetcher';
import { retryable, type FormResult } from './ResultNotice';

type Method = 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export function useSubmit() {
  const [fields, setFields] = useState<Record<string, string>>({});
  const [result, setResult] = useState<FormResult | null>(null);
  const [pending, setPending] = useState(false);
  const last = useRef<(() => Promise<void>) | null>(null);

  async function submit<T>(url: string, method: Method, body: unknown, okMessage: string, onOk: (data: T) => void) {
    const run = async () => {
      setPending(true);
      setResult(null);
      try {
        const r = await sendJson<T>(url, method, body);
        if (r.ok) {
          setFields({});
          setResult({ tone: 'info', text: okMessage });
          last.current = null;
          onOk(r.data);
        } else {
          setFields(r.fields);
          setResult({ tone: 'caution', text: r.message, retry: retryable(r.status) });
        }
      } finally {
        setPending(false);
      }
    };
    last.current = run;
    await run();
  }

  /** Sends the last failed request again, as it was. */
  async function retry() {
    if (last.current && !pending) await last.current();
  }

  return {
    fields,
    result,
    pending,
    submit,
    retry,
    /** The outcome as one line: the confirmation or what went wrong (for a plain status region). */
    status: result?.text ?? '',
    /** What went wrong, or '' after a success or before any submit. */
    error: result?.tone === 'caution' ? result.text : '',
    canRetry: Boolean(result?.retry),
  };
}
