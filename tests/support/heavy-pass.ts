// A new pass filled with many strokes through the app's own API, from a signed-in
// page (same site, its session), 250 strokes a batch to stay under the 1 MB limit.
// Used by the heavy-pass browser test and the bench's editor-open row.
import type { Page } from 'playwright-core';
import type { Stroke } from '@/lib/strokes/types';

export async function passFilledFrom(page: Page, gagId: string, strokes: Stroke[], batchPrefix: string): Promise<{ id: string; number: number }> {
  const pass = await page.evaluate(async (gag) => {
    const res = await fetch(`/api/gags/${gag}/passes`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
    if (!res.ok) throw new Error(`new pass: HTTP ${res.status}`);
    return (await res.json()) as { id: string; number: number };
  }, gagId);
  for (let i = 0; i < strokes.length; i += 250) {
    await page.evaluate(
      async ({ passId, batchId, ops }) => {
        const res = await fetch(`/api/passes/${passId}/ops`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ batchId, ops }),
        });
        if (!res.ok) throw new Error(`batch ${batchId}: HTTP ${res.status}`);
      },
      { passId: pass.id, batchId: `${batchPrefix}-${i}`, ops: strokes.slice(i, i + 250).map((stroke) => ({ op: 'add', stroke })) },
    );
  }
  return pass;
}
