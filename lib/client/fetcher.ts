// Client-side fetch helpers: SWR's fetcher throws on !res.ok; sendJson returns field errors for forms.
export class FetchError extends Error {
  constructor(public status: number, public body: { error?: string; message?: string; fields?: { field: string; message: string }[] }) {
    super(body?.message ?? `Request failed (${status})`);
  }
}

export async function fetcher<T = unknown>(url: string): Promise<T> {
  const res = await fetch(url, { headers: { accept: 'application/json' } });
  const body = await res.json().catch(() => ({}));
  if (!res.ok) throw new FetchError(res.status, body);
  return body as T;
}

export type SendResult<T> = { ok: true; data: T } | { ok: false; status: number; message: string; fields: Record<string, string> };

/** One request with a body, answered as a SendResult (no connection → status 0; field errors by path). */
async function send<T>(url: string, init: RequestInit): Promise<SendResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, init);
  } catch {
    return { ok: false, status: 0, message: 'No connection to Thawline. Check the network and try again.', fields: {} };
  }
  const data = await res.json().catch(() => ({}));
  if (res.ok) return { ok: true, data: data as T };
  const fields: Record<string, string> = {};
  for (const f of (data?.fields ?? []) as { field: string; message: string }[]) fields[f.field] ??= f.message;
  return { ok: false, status: res.status, message: data?.message ?? `Request failed (${res.status}).`, fields };
}

export async function sendJson<T = unknown>(url: string, method: 'POST' | 'PATCH' | 'PUT' | 'DELETE', body?: unknown): Promise<SendResult<T>> {
  return send<T>(url, {
    method,
    headers: { 'content-type': 'application/json', accept: 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

/** Sends a file as the request body (the CSV reader streams it on the server) and reads the JSON answer. */
export async function sendFile<T>(url: string, file: Blob): Promise<SendResult<T>> {
  return send<T>(url, { method: 'POST', body: file, headers: { 'content-type': 'text/csv', accept: 'application/json' } });
}
