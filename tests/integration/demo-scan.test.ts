// The demo's one pencil scan: stored through the S3 fake and placed under a pass, once.
import { describe, expect, it } from 'vitest';
import * as variantRoute from '@/app/api/uploads/[uploadId]/[variant]/route';
import { passState } from '@/db/queries/passes';
import { listUploads } from '@/db/queries/uploads';
import { DEMO_SCAN_PASS, seedDemoScan } from '@/db/seed/demo-scan';
import { callRouteRaw } from '../support/call-route';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID } from '../support/test-db';

const env = useS3AndDb();

describe('demo scan', () => {
  it('stores the scan at 300 ppi for the 150 mm page and places it under the whole page, once', async () => {
    expect(await seedDemoScan(env.db())).toMatch(/placed/);
    const uploads = await listUploads(env.db(), DEMO_SERIES_ID);
    expect(uploads).toHaveLength(1);
    // 150 mm at 300 ppi: 150 / 25.4 × 300 = 1771.65 → 1771 px (an inch is 25.4 mm exactly).
    expect(uploads[0]).toMatchObject({ width: 1771, height: 1771, mime: 'image/png' });
    const state = (await passState(env.db(), DEMO_SCAN_PASS))!;
    expect(state.lightboxes).toEqual([expect.objectContaining({ uploadId: uploads[0]!.id, panel: null, opacity: 0.35, visible: true })]);
    const res = await callRouteRaw(variantRoute.GET, { as: 'viewer', params: { uploadId: uploads[0]!.id, variant: 'working' } });
    expect(res.status).toBe(200);
    expect(await seedDemoScan(env.db())).toMatch(/already/);
    expect((await passState(env.db(), DEMO_SCAN_PASS))!.lightboxes).toHaveLength(1);
  });
});
