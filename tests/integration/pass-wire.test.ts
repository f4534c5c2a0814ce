// GET /api/passes/:id packed for the editor: the same strokes as the JSON
// answer, in under a third of the bytes, streamed in chunks.
import { beforeAll, describe, expect, it } from 'vitest';
import * as passesRoute from '@/app/api/gags/[gagId]/passes/route';
import * as passRoute from '@/app/api/passes/[passId]/route';
import { applyBatch } from '@/db/queries/batches';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import { PASS_MEDIA_TYPE, PassReader } from '@/lib/strokes/wire';
import { benchStrokes } from '../bench/strokes-fixture';
import { callRoute, sessionCookie } from '../support/call-route';
import { freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
let passId: string;
const N = 1000;

beforeAll(async () => {
  db = await freshDb();
  const r = await callRoute(passesRoute.POST, { method: 'POST', as: 'cocreator', params: { gagId: 'demo-gag-05' }, body: {} });
  passId = r.body.id;
  const strokes = benchStrokes(N);
  for (let i = 0; i < N; i += 100) {
    const ops = strokes.slice(i, i + 100).map((stroke) => ({ op: 'add' as const, stroke }));
    await applyBatch(db, { passId, batchId: `w-${i}`, ops, userId: 'demo-user-cocreator', spec: DEFAULT_PAGE_SPEC });
  }
  // One moved stroke and one erased, so offsets and removals travel too.
  await applyBatch(db, {
    passId,
    batchId: 'w-move',
    ops: [{ op: 'move', strokeIds: ['b3'], dx: 1.25, dy: -0.5 }],
    userId: 'demo-user-cocreator',
    spec: DEFAULT_PAGE_SPEC,
  });
  await applyBatch(db, {
    passId,
    batchId: 'w-erase',
    ops: [{ op: 'remove', strokeId: 'b4' }],
    userId: 'demo-user-cocreator',
    spec: DEFAULT_PAGE_SPEC,
  });
});

async function packed(as: 'viewer' | 'anonymous' = 'viewer') {
  const cookie = await sessionCookie(as);
  const headers = new Headers({ accept: PASS_MEDIA_TYPE });
  if (cookie) headers.set('cookie', cookie);
  return passRoute.GET(new Request(`http://localhost/api/passes/${passId}`, { headers }), { params: Promise.resolve({ passId }) });
}

describe('the packed pass', () => {
  it('carries exactly the strokes, rooms and seq of the JSON answer, in chunks, in under a third of its bytes', async () => {
    const json = await callRoute(passRoute.GET, { as: 'viewer', params: { passId } });
    const res = await packed();
    expect(res.headers.get('content-type')).toBe(PASS_MEDIA_TYPE);
    const reader = new PassReader();
    const strokes = [];
    let chunks = 0;
    let bytes = 0;
    for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
      chunks++;
      bytes += chunk.length;
      strokes.push(...reader.push(chunk));
    }
    const header = reader.finish();
    expect(strokes).toEqual(json.body.strokes);
    expect(strokes).toHaveLength(N - 1);
    expect(strokes.find((s) => s.id === 'b3')!.points[0]![0]).toBeCloseTo(
      json.body.strokes.find((s: { id: string }) => s.id === 'b3').points[0][0],
      9,
    );
    expect({ seq: header.seq, rooms: header.rooms, lightboxes: header.lightboxes }).toEqual({
      seq: json.body.seq,
      rooms: json.body.rooms,
      lightboxes: json.body.lightboxes,
    });
    expect(chunks).toBeGreaterThanOrEqual(3); // header, two runs of 500 strokes, the end mark
    const jsonBytes = Buffer.byteLength(JSON.stringify(json.body));
    expect(bytes / jsonBytes).toBeLessThan(1 / 3); // issue 14's goal, before HTTP compression
  });

  it('asks the same sign-in and role as the JSON answer', async () => {
    expect((await packed('anonymous')).status).toBe(401);
  });
});
