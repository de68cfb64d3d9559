// Sends a file as the request body (the CSV reader streams it on the server) and reads the JSON answer.
import type { SendResult } from '@/lib/client/fetcher';

export async function sendFile<T>(url: string, file: Blob): Promise<SendResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, { method: 'POST', body: file, headers: { 'content-type': 'text/csv', accept: 'application/json' } });
  } catch {
    return { ok: false, status: 0, message: 'No connection to Thawline. Check the network and try again.', fields: {} };
  }
  const data = await res.json().catch(() => ({}));
  if (res.ok) return { ok: true, data: data as T };
  const fields: Record<string, string> = {};
  for (const f of (data?.fields ?? []) as { field: string; message: string }[]) fields[f.field] ??= f.message;
  return { ok: false, status: res.status, message: data?.message ?? `Request failed (${res.status}).`, fields };
}
