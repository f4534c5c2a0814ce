'use client';
// A confirmation built on the native <dialog>: focus is trapped and Escape cancels.
import { useEffect, useRef } from 'react';
import { Button } from './button';

export function ConfirmDialog({
  open,
  title,
  body,
  confirmLabel,
  onConfirm,
  onCancel,
  busy,
}: {
  open: boolean;
  title: string;
  body: React.ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
      aria-labelledby="confirm-title"
      className="w-[min(28rem,92vw)] rounded-lg border border-paper-edge bg-paper p-0 text-graphite shadow-card backdrop:bg-graphite/40"
    >
      <div className="space-y-3 p-5">
        <h2 id="confirm-title" className="text-xl font-extrabold">
          {title}
        </h2>
        <div className="text-graphite-soft">{body}</div>
        <div className="flex justify-end gap-2 pt-2">
          <Button variant="secondary" onClick={onCancel} autoFocus>
            Cancel
          </Button>
          <Button variant="danger" onClick={onConfirm} disabled={busy}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
