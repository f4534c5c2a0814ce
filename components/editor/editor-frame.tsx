'use client';
// The editor's layout at every width. The page is always the largest thing on
// screen: on a wide screen the tools sit in a column on the left and the side
// panels on the right; below that (a tablet held upright, a phone) the tools are
// one scrolling strip above the canvas and the side panels fold into a drawer.
import { PanelRightClose, PanelRightOpen } from 'lucide-react';
import { useEffect, useState } from 'react';

export function EditorFrame({
  toolbar,
  canvas,
  sidebar,
  sidebarLabel,
}: {
  toolbar: React.ReactNode;
  canvas: React.ReactNode;
  sidebar: React.ReactNode;
  sidebarLabel: string;
}) {
  const [open, setOpen] = useState(false);
  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') setOpen(false);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [open]);
  return (
    <div className="flex h-[calc(100dvh-8.5rem)] min-h-[420px] flex-col gap-2 lg:flex-row">
      {toolbar}
      <div className="relative min-h-0 min-w-0 flex-1">
        {canvas}
        <button
          type="button"
          className="panel absolute right-2 top-2 z-20 inline-flex items-center gap-1 px-2 py-1 text-sm font-bold lg:hidden"
          aria-expanded={open}
          aria-controls="editor-side-panels"
          onClick={() => setOpen(true)}
        >
          <PanelRightOpen aria-hidden className="h-4 w-4" /> Panels
        </button>
      </div>
      {open && <div className="fixed inset-0 z-30 bg-graphite/30 lg:hidden" aria-hidden onClick={() => setOpen(false)} />}
      <aside
        id="editor-side-panels"
        aria-label={sidebarLabel}
        className={`${open ? 'fixed inset-y-0 right-0 z-40 flex w-[min(22rem,92vw)] bg-paper p-3 shadow-xl' : 'hidden'} flex-col gap-3 overflow-y-auto lg:static lg:z-auto lg:flex lg:w-80 lg:shrink-0 lg:bg-transparent lg:p-0 lg:shadow-none`}
      >
        <button
          type="button"
          className="inline-flex items-center gap-1 self-end rounded px-2 py-1 text-sm font-bold text-ink hover:bg-paper-deep lg:hidden"
          onClick={() => setOpen(false)}
        >
          <PanelRightClose aria-hidden className="h-4 w-4" /> Close panels
        </button>
        {sidebar}
      </aside>
    </div>
  );
}
