'use client';
// The keyboard map (shortcuts.ts) on the window, attached once; `handle` is the
// latest one each time, so it never re-attaches. A handled key does nothing else.
import { useEffect, useEffectEvent } from 'react';
import { type KeyAction, isTypingTarget, keyAction } from './shortcuts';

export function useEditorKeys(ctx: { arranging: boolean }, handle: (a: KeyAction) => boolean | void) {
  const onKey = useEffectEvent((e: KeyboardEvent) => {
    if (isTypingTarget(e.target)) return;
    const a = keyAction(e, ctx);
    if (!a) return;
    if (handle(a) === false) return;
    e.preventDefault();
  });
  useEffect(() => {
    const f = (e: KeyboardEvent) => onKey(e);
    window.addEventListener('keydown', f);
    return () => window.removeEventListener('keydown', f);
  }, []);
}
