// The editor page's first act, written into its HTML: a tiny script (with the page's CSP
// nonce) that starts reading the pass's strokes, packed, while the page's own scripts are
// still loading. The editor takes that answer through pass-prefetch.ts. A page reached by
// navigating inside the app runs no such script; the editor then asks at hydration.
import { headers } from 'next/headers';
import { PASS_MEDIA_TYPE } from '@/lib/strokes/wire';

/** Where the early reads wait for the editor, by pass id (window.__quadrillePassReads). */
export const EARLY_READS = '__quadrillePassReads';

export async function PassEarlyRead({ passId }: { passId: string }) {
  const nonce = (await headers()).get('x-nonce') ?? undefined;
  const id = JSON.stringify(passId);
  const init = JSON.stringify({ cache: 'no-store', headers: { accept: PASS_MEDIA_TYPE } });
  // A failed read is settled here so it is not reported as unhandled; the editor sees the failure and asks again.
  const code = `(function(){var r=window.${EARLY_READS}=window.${EARLY_READS}||{};var p=fetch('/api/passes/'+${id},${init});p.catch(function(){});r[${id}]=p;})();`;
  return <script nonce={nonce} suppressHydrationWarning dangerouslySetInnerHTML={{ __html: code }} />;
}
