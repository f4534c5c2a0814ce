'use client';
// Konva needs a browser: the editor is loaded on the client only.
import dynamic from 'next/dynamic';
import { LiveProvider } from '@/components/live/live-provider';
import type { EditorProps } from './types';

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
  return (
    <LiveProvider url={`/api/passes/${props.passId}/events`} gagId={props.gagId} where={`pass:${props.passNumber}`}>
      <Editor {...props} />
    </LiveProvider>
  );
}
