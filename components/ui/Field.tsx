import type { ComponentProps, ReactNode } from 'react';

const inputClass =
  'block w-full min-h-11 rounded-xl border border-slate-300 bg-white px-3 text-base text-slate-900 shadow-sm placeholder:text-slate-400 focus:border-ice-500 focus:outline-none focus:ring-2 focus:ring-ice-300 aria-[invalid=true]:border-red-500 dark:border-slate-700 dark:bg-slate-950 dark:text-slate-100 sm:text-sm';

interface FieldProps {
  id: string;
  label: string;
  error?: string;
  hint?: ReactNode;
  children?: ReactNode;
}

/** A labelled control with its hint and error wired through aria-describedby. */
export function FieldShell({ id, label, error, hint, children }: FieldProps) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-slate-800 dark:text-slate-200">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-xs text-slate-500 dark:text-slate-400">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-medium text-red-700 dark:text-red-300">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function describedBy(id: string, error?: string, hint?: ReactNode) {
  return [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
}

export function TextField({ id, label, error, hint, ...input }: FieldProps & ComponentProps<'input'>) {
  return (
    <FieldShell id={id} label={label} error={error} hint={hint}>
      <input id={id} name={input.name ?? id} className={inputClass} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, error, hint)} {...input} />
    </FieldShell>
  );
}

export function SelectField({ id, label, error, hint, children, ...select }: FieldProps & ComponentProps<'select'>) {
  return (
    <FieldShell id={id} label={label} error={error} hint={hint}>
      <select id={id} name={select.name ?? id} className={inputClass} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, error, hint)} {...select}>
        {children}
      </select>
    </FieldShell>
  );
}

export { inputClass };
