'use client';
// Sortable tables: a hook that sorts rows by a column's key, and a header cell that toggles it.
import { useMemo, useState } from 'react';

export type SortDir = 'asc' | 'desc';
type Key = string | number | null | undefined;

export function useSorted<T, C extends string>(rows: T[], keys: Record<C, (r: T) => Key>, initial: { by: C; dir?: SortDir }) {
  const [sort, setSort] = useState<{ by: C; dir: SortDir }>({ by: initial.by, dir: initial.dir ?? 'asc' });
  const sorted = useMemo(() => {
    const get = keys[sort.by];
    const sign = sort.dir === 'asc' ? 1 : -1;
    return [...rows].sort((a, b) => {
      const x = get(a);
      const y = get(b);
      // Empty values go last either way.
      if (x === null || x === undefined) return y === null || y === undefined ? 0 : 1;
      if (y === null || y === undefined) return -1;
      const c = typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y), 'en', { sensitivity: 'base', numeric: true });
      return c * sign;
    });
    // keys is a constant table per caller
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [rows, sort]);
  const toggle = (by: C) => setSort((s) => (s.by === by ? { by, dir: s.dir === 'asc' ? 'desc' : 'asc' } : { by, dir: 'asc' }));
  return { sorted, sort, toggle };
}

export function SortHeader<C extends string>({
  col,
  label,
  sort,
  onSort,
  className = '',
  align = 'left',
}: {
  col: C;
  label: string;
  sort: { by: C; dir: SortDir };
  onSort: (c: C) => void;
  className?: string;
  align?: 'left' | 'right';
}) {
  const active = sort.by === col;
  return (
    <th scope="col" aria-sort={active ? (sort.dir === 'asc' ? 'ascending' : 'descending') : 'none'} className={`px-2 py-1.5 ${align === 'right' ? 'text-right' : ''} ${className}`}>
      <button
        type="button"
        onClick={() => onSort(col)}
        className={`inline-flex min-h-9 items-center gap-1 rounded-lg px-2 text-xs font-semibold uppercase tracking-wide hover:bg-slate-200/70 dark:hover:bg-slate-700/60 ${align === 'right' ? 'flex-row-reverse' : ''} ${active ? 'text-slate-900 dark:text-white' : ''}`}
      >
        {label}
        <svg viewBox="0 0 10 12" className={`h-3 w-2.5 ${active ? 'opacity-100' : 'opacity-35'}`} aria-hidden="true">
          <path d="M5 1 8.5 5h-7z" className={active && sort.dir === 'asc' ? 'fill-current' : 'fill-slate-400'} />
          <path d="M5 11 1.5 7h7z" className={active && sort.dir === 'desc' ? 'fill-current' : 'fill-slate-400'} />
        </svg>
        <span className="sr-only">{active ? (sort.dir === 'asc' ? ', sorted ascending' : ', sorted descending') : ', sort'}</span>
      </button>
    </th>
  );
}

export const theadClass = 'bg-slate-50 text-xs uppercase tracking-wide text-slate-600 dark:bg-slate-800/60 dark:text-slate-400';

/** A card for a table: no inner padding, rounded edge; the scroll box is positioned so hidden labels stay inside it. */
export function TableCard({ children, className = '', ...rest }: React.ComponentProps<'section'>) {
  return (
    <section className={`overflow-hidden rounded-2xl border border-slate-200 bg-white shadow-sm dark:border-slate-800 dark:bg-slate-900 ${className}`} {...rest}>
      {children}
    </section>
  );
}

export function TableScroll({ children }: { children: React.ReactNode }) {
  return <div className="relative overflow-x-auto">{children}</div>;
}
