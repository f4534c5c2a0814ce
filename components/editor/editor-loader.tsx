'use client';
// Konva needs a browser: the editor is loaded on the client only.
import dynamic from 'next/dynamic';
import { useEffect } from 'react';
import { LiveProvider } from '@/components/live/live-provider';
import { prefetchPass } from './pass-prefetch';
import type { EditorProps } from './types';

// The editor's code (the canvas library with it) is asked for as soon as this module runs, with the
// page's own scripts, rather than when the loader first renders after hydration: it then arrives
// with the pass's strokes, which the page's HTML started reading (pass-early-read.tsx).
if (typeof window !== 'undefined') void import('./editor').catch(() => undefined);

const Editor = dynamic(() => import('./editor'), {
  ssr: false,
  loading: () => (
    <p role="status" className="py-16 text-center text-graphite-faint">
      Laying out the page…
    </p>
  ),
});

/** The editor inside its pass's live stream (others' strokes, comments, who is on which panel). */
export function EditorLoader(props: EditorProps) {
  // The pass's strokes start coming while the editor's code is still loading.
  useEffect(() => prefetchPass(props.passId), [props.passId]);
  return (
    <LiveProvider url={`/api/passes/${props.passId}/events`} gagId={props.gagId} where={`pass:${props.passNumber}`}>
      <Editor {...props} />
    </LiveProvider>
  );
}
