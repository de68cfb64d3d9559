// The permission map against its specification: the role × permission table in docs/product.md.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { can, PERMISSIONS, ROLES, type Permission } from '@/lib/auth/permissions';

/** Every permission (the type checks that none is missing). */
const ALL = [
  'org:read',
  'users:manage',
  'airfields:edit',
  'aircraft:edit',
  'plans:manage',
  'departures:book-any',
  'departures:book-own',
  'oil-log:write',
  'mail:view',
  'simulate',
] as const satisfies readonly Permission[];
const exhaustive: [Permission] extends [(typeof ALL)[number]] ? true : never = true;
void exhaustive;

/** The table's rows: permission → role → allowed. */
function specification(): Map<string, Record<string, boolean>> {
  const text = readFileSync(path.join(import.meta.dirname, '../../docs/product.md'), 'utf8');
  const lines = text.split('\n').filter((l) => l.startsWith('| '));
  const head = lines.findIndex((l) => /^\|\s*permission\s*\|/.test(l));
  expect(head, 'the permission table in docs/product.md').toBeGreaterThanOrEqual(0);
  const cells = (l: string) => l.split('|').slice(1, -1).map((c) => c.trim());
  const roles = cells(lines[head]).slice(1);
  const rows = new Map<string, Record<string, boolean>>();
  for (const l of lines.slice(head + 2)) {
    const [name, ...values] = cells(l);
    if (!name || values.length !== roles.length) break;
    rows.set(name.split(' ')[0], Object.fromEntries(roles.map((r, i) => [r, values[i] === 'yes'])));
  }
  return rows;
}

describe('the permission map', () => {
  const spec = specification();

  it('has a row in the table for every permission and a column for every role', () => {
    expect([...spec.keys()].sort()).toEqual([...ALL].sort());
    for (const row of spec.values()) expect(Object.keys(row).sort()).toEqual([...ROLES].sort());
  });

  for (const role of ROLES) {
    for (const permission of ALL) {
      it(`${role} ${spec.get(permission)?.[role] ? 'may' : 'may not'} ${permission}`, () => {
        expect(can(role, permission)).toBe(spec.get(permission)?.[role]);
      });
    }
  }

  it('lists no permission twice for a role', () => {
    for (const role of ROLES) expect(new Set(PERMISSIONS[role]).size).toBe(PERMISSIONS[role].length);
  });
});
