'use client';
// A modal on the native <dialog>: focus stays inside, Escape asks to close.
import { useEffect, useRef } from 'react';

export function Modal({
  open,
  onClose,
  labelledBy,
  width = '28rem',
  children,
}: {
  open: boolean;
  onClose: () => void;
  labelledBy: string;
  width?: string;
  children: React.ReactNode;
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
        onClose();
      }}
      aria-labelledby={labelledBy}
      style={{ width: `min(${width}, 94vw)` }}
      className="rounded-lg border border-paper-edge bg-paper p-0 text-graphite shadow-card backdrop:bg-graphite/40"
    >
      <div className="space-y-3 p-5">{children}</div>
    </dialog>
  );
}
