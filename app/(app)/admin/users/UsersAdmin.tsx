'use client';
import useSWR from 'swr';
import { useState } from 'react';
import { Button, Card } from '@/components/ui/primitives';
import { SelectField, TextField } from '@/components/ui/Field';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import { ROLES, ROLE_LABEL, type Role } from '@/lib/auth/permissions';
import type { UserRow } from '@/lib/data/users';

const ROLE_HINT: Record<Role, string> = {
  manager: 'Airfields, shelters, users, tariffs; gets the cold-night notice.',
  operator: 'Aircraft, heaters, heat plans; the Morning board.',
  pilot: 'Books departures, sees the oil-too-cold warning, logs oil checks.',
};

export function UsersAdmin({ initial, selfId }: { initial: UserRow[]; selfId: number }) {
  const { data, mutate } = useSWR<{ users: UserRow[] }>('/api/users', fetcher, { fallbackData: { users: initial } });
  const users = data?.users ?? initial;
  const [status, setStatus] = useState('');

  async function resend(u: UserRow) {
    const r = await sendJson('/api/tokens/invitations', 'POST', { userId: u.id });
    setStatus(r.ok ? `A new invitation is on its way to ${u.email}. The earlier link no longer works.` : r.message);
  }

  async function patch(id: number, change: { role?: Role; active?: boolean }) {
    const r = await sendJson(`/api/users/${id}`, 'PATCH', change);
    setStatus(r.ok ? 'Saved.' : r.message);
    await mutate();
  }

  return (
    <div className="grid gap-4 xl:grid-cols-[1fr_22rem]">
      <Card className="overflow-hidden p-0 sm:p-0">
        <p role="status" aria-live="polite" className="sr-only">{status}</p>
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Users of your organization</caption>
          <thead className="bg-slate-50 text-xs uppercase tracking-wide text-slate-600 dark:bg-slate-800/60 dark:text-slate-400">
            <tr>
              <th scope="col" className="px-4 py-3">Name</th>
              <th scope="col" className="hidden px-4 py-3 md:table-cell">E-mail</th>
              <th scope="col" className="px-4 py-3">Role</th>
              <th scope="col" className="hidden px-4 py-3 text-right sm:table-cell">Access</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
            {users.map((u) => (
              <tr key={u.id} className={u.active ? '' : 'opacity-60'}>
                <td className="px-4 py-3">
                  <div className="font-medium text-slate-900 dark:text-white">{u.name}</div>
                  <div className="text-xs text-slate-500 md:hidden">{u.email}</div>
                  {u.mustChangePassword && u.active ? (
                    <div className="flex flex-wrap items-center gap-x-2 text-xs text-amber-700 dark:text-amber-300">
                      No password of their own yet
                      <button type="button" className="min-h-8 font-semibold text-ice-800 underline dark:text-ice-200" onClick={() => resend(u)}>
                        Send a new invitation<span className="sr-only"> to {u.name}</span>
                      </button>
                    </div>
                  ) : null}
                  {!u.active ? <div className="text-xs font-semibold text-slate-600 dark:text-slate-400">Deactivated</div> : null}
                  <div className="mt-2 sm:hidden">
                    <AccessButton u={u} selfId={selfId} onToggle={() => patch(u.id, { active: !u.active })} />
                  </div>
                </td>
                <td className="hidden px-4 py-3 md:table-cell">{u.email}</td>
                <td className="px-4 py-3">
                  <label className="sr-only" htmlFor={`role-${u.id}`}>Role of {u.name}</label>
                  <select
                    id={`role-${u.id}`}
                    className={compactSelect}
                    value={u.role}
                    disabled={u.id === selfId}
                    onChange={(e) => patch(u.id, { role: e.target.value as Role })}
                  >
                    {ROLES.map((r) => (
                      <option key={r} value={r}>{ROLE_LABEL[r]}</option>
                    ))}
                  </select>
                </td>
                <td className="hidden px-4 py-3 text-right sm:table-cell">
                  <AccessButton u={u} selfId={selfId} onToggle={() => patch(u.id, { active: !u.active })} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Card>
      <AddUser onAdded={() => mutate()} />
    </div>
  );
}

const compactSelect =
  'min-h-11 w-32 rounded-xl border border-slate-300 bg-white px-2 text-sm text-slate-900 disabled:opacity-70 dark:border-slate-700 dark:bg-slate-950 dark:text-slate-100';

function AccessButton({ u, selfId, onToggle }: { u: UserRow; selfId: number; onToggle: () => void }) {
  if (u.id === selfId) return <span className="text-xs text-slate-500">You</span>;
  return (
    <Button variant={u.active ? 'danger' : 'secondary'} className="min-h-10 px-3" onClick={onToggle}>
      {u.active ? 'Deactivate' : 'Reactivate'}
      <span className="sr-only"> {u.name}</span>
    </Button>
  );
}

function AddUser({ onAdded }: { onAdded: () => void }) {
  const [form, setForm] = useState({ name: '', email: '', role: 'pilot' as Role });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setForm((f) => ({ ...f, [k]: e.target.value }));

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    const r = await sendJson('/api/users', 'POST', form);
    setPending(false);
    if (r.ok) {
      setStatus(`Added ${form.name}. An invitation is on its way to ${form.email}: they choose their password with its link (valid for 7 days).`);
      setFields({});
      setForm({ name: '', email: '', role: 'pilot' });
      onAdded();
    } else {
      setFields(r.fields);
      setStatus(r.message);
    }
  }

  return (
    <Card aria-labelledby="add-user-h">
      <h2 id="add-user-h" className="text-lg font-semibold">Invite a user</h2>
      <form onSubmit={onSubmit} className="mt-4 space-y-4" noValidate>
        <TextField id="new-name" name="name" label="Name" value={form.name} onChange={set('name')} error={fields.name} autoComplete="off" />
        <TextField id="new-email" name="email" label="E-mail" type="email" value={form.email} onChange={set('email')} error={fields.email} autoComplete="off" />
        <SelectField id="new-role" name="role" label="Role" value={form.role} onChange={set('role')} error={fields.role} hint={ROLE_HINT[form.role]}>
          {ROLES.map((r) => (
            <option key={r} value={r}>{ROLE_LABEL[r]}</option>
          ))}
        </SelectField>
        <p className="text-xs text-slate-600 dark:text-slate-400">Thawline e-mails them an invitation with a single-use link to choose their own password.</p>
        <Button type="submit" disabled={pending} className="w-full">{pending ? 'Inviting…' : 'Invite user'}</Button>
        <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">{status}</p>
      </form>
    </Card>
  );
}
