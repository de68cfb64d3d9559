'use client';
// A form's submit button with its pending label, the status line beside it (a polite live region)
// and "Try again" when the last request failed on the way or on the server. Pairs with useSubmit().
import { Button, type ButtonVariant } from './primitives';

export function SubmitRow({
  label,
  pending,
  status,
  canRetry,
  onRetry,
  variant = 'primary',
  className,
}: {
  label: string;
  pending: boolean;
  status: string;
  canRetry: boolean;
  onRetry: () => void;
  variant?: ButtonVariant;
  className?: string;
}) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button type="submit" variant={variant} disabled={pending} className={className}>
        {pending ? 'Saving…' : label}
      </Button>
      <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">
        {status}
      </p>
      {canRetry ? (
        <Button type="button" variant="secondary" onClick={onRetry} disabled={pending}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
