'use client';
// The comment box of a new pin, beside the pin on the canvas (not down the side panel):
// where the pin is, in words that read as a position, and a note to post with it.
import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { useComments } from '@/hooks/use-review';
import { messageOf } from '@/lib/http/client';
import { type View, toScreen } from '@/lib/print/view';
import { pointWhere } from '@/lib/review/words';
import type { PointPin } from './editor-sidebar';

const WIDTH = 280;
const HEIGHT = 190;

export function PinComposer(p: { pin: PointPin; view: View; size: { w: number; h: number }; gagId: string; passId: string; onDone: () => void }) {
  const { post } = useComments(p.gagId);
  const [body, setBody] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const box = useRef<HTMLTextAreaElement>(null);
  const form = useRef<HTMLFormElement>(null);
  useEffect(() => box.current?.focus(), [p.pin]);
  // A press inside the box is not a press on the page: stopped here, natively, before the canvas's
  // own listeners (on the element around it) would place a new pin or capture the pointer.
  useEffect(() => {
    const el = form.current;
    if (!el) return;
    const stop = (e: Event) => e.stopPropagation();
    el.addEventListener('pointerdown', stop);
    el.addEventListener('wheel', stop);
    return () => {
      el.removeEventListener('pointerdown', stop);
      el.removeEventListener('wheel', stop);
    };
  }, []);
  const at = toScreen(p.view, p.pin.x, p.pin.y);
  // Beside the pin, on the side with room, and always inside the canvas.
  const left = Math.max(8, Math.min(at.x + 16 + WIDTH > p.size.w ? at.x - 16 - WIDTH : at.x + 16, p.size.w - WIDTH - 8));
  const top = Math.max(8, Math.min(at.y - 24, p.size.h - HEIGHT - 8));
  const send = async () => {
    setBusy(true);
    setError(null);
    try {
      await post({ body, target: 'point', passId: p.passId, panel: p.pin.panel, x: p.pin.x, y: p.pin.y });
      p.onDone();
    } catch (err) {
      setError(messageOf(err, 'The comment could not be posted; try again.'));
    } finally {
      setBusy(false);
    }
  };
  return (
    <form
      ref={form}
      data-testid="pin-composer"
      aria-label="New pin"
      style={{ left, top, width: WIDTH }}
      className="panel absolute z-10 space-y-2 p-3 text-sm shadow-card"
      onSubmit={(e) => {
        e.preventDefault();
        void send();
      }}
      onKeyDown={(e) => {
        if (e.key === 'Escape') p.onDone();
        e.stopPropagation(); // typing here is not a shortcut
      }}
    >
      <p className="text-graphite-soft">
        Panel {p.pin.panel + 1}, {pointWhere(p.pin.x, p.pin.y)}
      </p>
      <label className="sr-only" htmlFor="pin-comment">
        Comment on this point
      </label>
      <textarea
        id="pin-comment"
        ref={box}
        value={body}
        onChange={(e) => setBody(e.target.value)}
        rows={3}
        maxLength={4000}
        className="field w-full"
      />
      {error && (
        <p role="alert" className="text-stamp">
          {error}
        </p>
      )}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={p.onDone}>
          Drop pin
        </Button>
        <Button type="submit" disabled={busy || !body.trim()}>
          Post
        </Button>
      </div>
    </form>
  );
}
