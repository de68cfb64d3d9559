'use client';
// The app's own confirm dialog (a modal <dialog>), in place of the browser's window.confirm: it
// matches the app's look, names its buttons by what they do, is reachable by keyboard (Escape
// cancels, focus starts on the safe choice) and works the same on every phone browser.
//
//   const { confirm, dialog } = useConfirm();
//   if (!(await confirm({ title: 'Remove log?', body: '…', confirmLabel: 'Remove log' }))) return;
//   …and render {dialog} once in the component.
import { useCallback, useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Button, type ButtonVariant } from './primitives';

export interface ConfirmRequest {
  title: string;
  body?: ReactNode;
  /** The button that goes ahead, named by what it does ("Cancel departure", "Remove log"). */
  confirmLabel: string;
  /** The button that backs out; "Keep" by default. */
  cancelLabel?: string;
  tone?: Extract<ButtonVariant, 'danger' | 'primary' | 'heat'>;
}

export function useConfirm() {
  const [request, setRequest] = useState<(ConfirmRequest & { resolve: (ok: boolean) => void }) | null>(null);
  const confirm = useCallback(
    (r: ConfirmRequest) =>
      new Promise<boolean>((resolve) => {
        setRequest({ ...r, resolve });
      }),
    [],
  );
  const close = useCallback(
    (ok: boolean) => {
      request?.resolve(ok);
      setRequest(null);
    },
    [request],
  );
  const dialog = request ? <ConfirmDialog request={request} onClose={close} /> : null;
  return { confirm, dialog };
}

function ConfirmDialog({ request, onClose }: { request: ConfirmRequest; onClose: (ok: boolean) => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const keepRef = useRef<HTMLButtonElement>(null);
  const titleId = useId();
  const bodyId = useId();
  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal();
    keepRef.current?.focus();
  }, []);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={request.body ? bodyId : undefined}
      onCancel={(e) => {
        e.preventDefault();
        onClose(false);
      }}
      className="w-[min(28rem,calc(100vw-2rem))] rounded-2xl border border-slate-200 bg-white p-0 text-slate-900 shadow-xl backdrop:bg-slate-950/50 dark:border-slate-700 dark:bg-slate-900 dark:text-slate-100"
    >
      <div className="p-5">
        <h2 id={titleId} className="text-lg font-semibold">
          {request.title}
        </h2>
        {request.body ? (
          <div id={bodyId} className="mt-2 text-sm text-slate-700 dark:text-slate-300">
            {request.body}
          </div>
        ) : null}
        <div className="mt-5 flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <Button ref={keepRef} type="button" variant="secondary" onClick={() => onClose(false)}>
            {request.cancelLabel ?? 'Keep'}
          </Button>
          <Button type="button" variant={request.tone ?? 'danger'} onClick={() => onClose(true)}>
            {request.confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
