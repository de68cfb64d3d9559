// The outcome of a form submit, in a polite live region: a confirmation, or what went wrong with a
// list of the fields at fault (each optionally a link to its input). Used by the record forms.
import { Notice } from '@/components/ui/primitives';

export interface FormResult {
  tone: 'info' | 'caution';
  text: string;
  /** The request failed on the way or on the server (not the input): offer to send it again. */
  retry?: boolean;
}

/** A failure worth retrying as it is: no connection, the server's own trouble, or too many requests. */
export const retryable = (status: number) => status === 0 || status === 429 || status >= 500;

export function ResultNotice({
  result,
  okTitle,
  failTitle,
  errors = [],
  onRetry,
}: {
  onRetry?: () => void;
  result: FormResult | null;
  okTitle?: string;
  failTitle: string;
  errors?: { key: string; label?: string; message: string; href?: string }[];
}) {
  return (
    <div role="status" aria-live="polite">
      {result ? (
        <Notice tone={result.tone} title={result.tone === 'info' ? okTitle : failTitle}>
          <p>{result.text}</p>
          {result.tone !== 'info' && errors.length ? (
            <ul className="mt-1 list-disc space-y-0.5 pl-5">
              {errors.map((e) => (
                <li key={e.key}>
                  {e.label ? (
                    <>
                      {e.href ? (
                        <a className="underline" href={e.href}>
                          {e.label}
                        </a>
                      ) : (
                        e.label
                      )}
                      {': '}
                    </>
                  ) : null}
                  {e.message}
                </li>
              ))}
            </ul>
          ) : null}
          {result.tone !== 'info' && result.retry && onRetry ? (
            <button type="button" onClick={onRetry} className="mt-2 inline-flex min-h-11 items-center rounded-lg border border-current px-4 text-sm font-semibold">
              Try again
            </button>
          ) : null}
        </Notice>
      ) : null}
    </div>
  );
}
