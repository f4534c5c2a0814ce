'use client';
// Where the page sits on screen: the canvas size (followed with a ResizeObserver),
// the view transform (zoom and pan), fitting the page, and a re-raster of the
// stroke bitmaps once a zoom has settled.
import { type RefObject, useCallback, useEffect, useLayoutEffect, useRef, useState } from 'react';
import type { Rect } from '@/lib/print/geometry';
import { type View, fitView, zoomAt } from '@/lib/print/view';

/** The page with its bleed and the beat labels above and below it. */
const fitPage = (bleed: Rect, w: number, h: number) => fitView(bleed.x, bleed.y - 6, bleed.w, bleed.h + 14, w, h, 16);

export function useView(o: { wrapRef: RefObject<HTMLDivElement | null>; bleed: Rect; onSettled: (pxPerMm: number) => void }) {
  const [size, setSize] = useState({ w: 800, h: 600 });
  const [view, setView] = useState<View>({ scale: 3, originX: 20, originY: 20 });
  /** The view as of now, for event handlers between renders. */
  const viewRef = useRef(view);
  useEffect(() => {
    viewRef.current = view;
  }, [view]);
  const update = useCallback((f: (v: View) => View) => {
    setView((v) => {
      const next = f(v);
      viewRef.current = next;
      return next;
    });
  }, []);

  // Re-raster once a zoom settles (the session skips it when the resolution is close enough).
  const onSettled = useRef(o.onSettled);
  useEffect(() => {
    onSettled.current = o.onSettled;
  });

  const { wrapRef, bleed } = o;
  // The page is fitted before any effect runs, so the pass's strokes (which may all be here at once,
  // read while the page loaded) are rastered once, at the resolution they are shown at.
  useLayoutEffect(() => {
    const el = wrapRef.current;
    if (!el) return;
    const w = Math.max(200, Math.floor(el.clientWidth));
    const h = Math.max(200, Math.floor(el.clientHeight));
    const fitted = fitPage(bleed, w, h);
    // Known at once to the effects that run after this one: the session sets its bitmaps' resolution from it
    // (the state update below is only read at the next render, after those effects ran with the old view).
    viewRef.current = fitted;
    setSize({ w, h });
    update(() => fitted);
  }, [wrapRef, bleed, update]);

  useEffect(() => {
    const el = wrapRef.current;
    if (!el) return;
    let first = true;
    const ro = new ResizeObserver(([entry]) => {
      if (!entry) return;
      const w = Math.max(200, Math.floor(entry.contentRect.width));
      const h = Math.max(200, Math.floor(entry.contentRect.height));
      setSize({ w, h });
      if (first) {
        // The first fit sets the bitmaps' resolution at once, before the pass's strokes arrive to be drawn.
        first = false;
        const fitted = fitPage(bleed, w, h);
        update(() => fitted);
        onSettled.current(fitted.scale * (window.devicePixelRatio || 1));
      }
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, [wrapRef, bleed, update]);

  useEffect(() => {
    const t = setTimeout(() => onSettled.current(view.scale * (window.devicePixelRatio || 1)), 180);
    return () => clearTimeout(t);
  }, [view.scale]);

  const fit = useCallback(() => update(() => fitPage(bleed, size.w, size.h)), [bleed, size, update]);
  const zoom = useCallback((factor: number) => update((v) => zoomAt(v, factor, size.w / 2, size.h / 2)), [size, update]);
  const panBy = useCallback((dx: number, dy: number) => update((v) => ({ ...v, originX: v.originX + dx, originY: v.originY + dy })), [update]);

  return { size, view, viewRef, setView: update, fit, zoom, panBy };
}
