// What a log line may say about an error: its name and driver code, never the SQL, its bound values,
// a token or a password. A database error's message can quote the values of the statement, so only
// errors that did not come from the database keep a short message.

/** One short, safe description of a thrown value for a log line ("SequelizeDatabaseError (SQLITE_ERROR)"). */
export function describeError(err: unknown): string {
  if (!(err instanceof Error) && (typeof err !== 'object' || err === null)) return typeof err;
  const e = err as { name?: unknown; code?: unknown; sql?: unknown; parent?: { code?: unknown }; original?: { code?: unknown }; message?: unknown };
  const name = typeof e.name === 'string' ? e.name : 'Error';
  const rawCode = e.parent?.code ?? e.original?.code ?? e.code;
  const code = typeof rawCode === 'string' || typeof rawCode === 'number' ? String(rawCode).slice(0, 40) : '';
  const fromDatabase = name.startsWith('Sequelize') || e.sql !== undefined || e.parent !== undefined || e.original !== undefined || code !== '';
  const message = !fromDatabase && typeof e.message === 'string' ? e.message.replace(/\s+/g, ' ').slice(0, 160) : '';
  return [name, code ? `(${code})` : '', message ? `: ${message}` : ''].filter(Boolean).join(' ').replace(' :', ':');
}

/** Logs a failure of one item of a job (an organization, a row) by its ids, and carries on. */
export function logSkipped(what: string, ids: Record<string, string | number | null | undefined>, err: unknown) {
  const where = Object.entries(ids)
    .filter(([, v]) => v !== undefined && v !== null)
    .map(([k, v]) => `${k}=${v}`)
    .join(' ');
  console.error(`[thawline] ${what} skipped${where ? ` (${where})` : ''}: ${describeError(err)}`);
}
