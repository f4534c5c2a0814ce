'use client';
// Konva needs a browser: the editor is loaded on the client only.
import dynamic from 'next/dynamic';
import type { EditorProps } from './editor';

const Editor = dynamic(() => import('./editor'), {
  ssr: false,
  loading: () => (
    <p role="status" className="py-16 text-center text-graphite-faint">
      Laying out the page…
    </p>
  ),
});

export function EditorLoader(props: EditorProps) {
  return <Editor {...props} />;
}
