// Uploads against the running S3 fake (s3rver), with images made by sharp here.
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import * as uploadsRoute from '@/app/api/series/[seriesId]/uploads/route';
import * as uploadRoute from '@/app/api/uploads/[uploadId]/route';
import * as variantRoute from '@/app/api/uploads/[uploadId]/[variant]/route';
import { effectivePpi } from '@/lib/print/ppi';
import { sessionCookie } from '../support/call-route';
import { useS3AndDb } from '../support/s3-fake';
import { DEMO_SERIES_ID, type Persona } from '../support/test-db';

const env = useS3AndDb();
const db = () => env.db();

async function upload(bytes: Buffer, name: string, as: Persona = 'cocreator', seriesId = DEMO_SERIES_ID) {
  const form = new FormData();
  form.append('file', new File([new Uint8Array(bytes)], name, { type: 'image/png' }));
  const headers = new Headers();
  const cookie = await sessionCookie(as);
  if (cookie) headers.set('cookie', cookie);
  const res = await uploadsRoute.POST(new Request('http://localhost/x', { method: 'POST', body: form, headers }), {
    params: Promise.resolve({ seriesId }),
  });
  return { status: res.status, body: await res.json() };
}

async function variant(uploadId: string, v: string, as: Persona = 'viewer') {
  const headers = new Headers();
  const cookie = await sessionCookie(as);
  if (cookie) headers.set('cookie', cookie);
  return variantRoute.GET(new Request('http://localhost/x', { headers }), { params: Promise.resolve({ uploadId, variant: v }) });
}

const png = (w: number, h: number) =>
  sharp({ create: { width: w, height: h, channels: 3, background: '#d9d7d2' } })
    .png()
    .toBuffer();

describe('uploads', () => {
  it('round-trips through the S3 fake; a PNG named .jpg is taken as a PNG', async () => {
    const bytes = await png(40, 20);
    const r = await upload(bytes, 'pier-scan.jpg');
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ width: 40, height: 20, bytes: bytes.byteLength, mime: 'image/png', name: 'pier-scan.jpg' });
    expect(r.body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const orig = await variant(r.body.id, 'original');
    expect(orig.headers.get('content-type')).toBe('image/png');
    const meta = await sharp(Buffer.from(await orig.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([40, 20]);
    const prev = await variant(r.body.id, 'preview');
    expect(prev.headers.get('content-type')).toBe('image/webp');
  });

  it('the same file twice is stored once', async () => {
    const bytes = await png(41, 21);
    const a = await upload(bytes, 'a.png');
    const b = await upload(bytes, 'b.png');
    expect(a.status).toBe(201);
    expect(b).toMatchObject({ status: 200, body: { id: a.body.id, duplicate: true } });
    const rows = await db().selectFrom('uploads').select('id').where('sha256', '=', a.body.sha256).execute();
    expect(rows).toHaveLength(1);
  });

  it('the same file sent six times at once: one 201, five 200 "duplicate", stored once, never a 500', async () => {
    const bytes = await png(43, 23);
    const all = await Promise.all(Array.from({ length: 6 }, (_, i) => upload(bytes, `same-${i}.png`)));
    expect(all.map((r) => r.status).sort()).toEqual([200, 200, 200, 200, 200, 201]);
    expect(new Set(all.map((r) => r.body.id)).size).toBe(1);
    expect(all.filter((r) => r.body.duplicate)).toHaveLength(5);
    const rows = await db().selectFrom('uploads').select('id').where('sha256', '=', all[0]!.body.sha256).execute();
    expect(rows).toHaveLength(1);
  });

  it('turns the image upright from EXIF orientation 6 (width and height swapped) and strips GPS', async () => {
    const jpeg = await sharp({ create: { width: 60, height: 30, channels: 3, background: '#8c8983' } })
      .jpeg()
      .withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const before = await sharp(jpeg).metadata();
    expect(before.orientation).toBe(6);
    // The GPS IFD pointer is EXIF tag 0x8825 (EXIF 2.3, §4.6.3): present before upload.
    const hasGpsTag = (b: Buffer) => b.includes(Buffer.from([0x88, 0x25])) || b.includes(Buffer.from([0x25, 0x88]));
    expect(hasGpsTag(before.exif!)).toBe(true);
    const r = await upload(jpeg, 'phone.jpg');
    expect(r.status).toBe(201);
    expect([r.body.width, r.body.height]).toEqual([30, 60]);
    const stored = Buffer.from(await (await variant(r.body.id, 'original')).arrayBuffer());
    const meta = await sharp(stored).metadata();
    expect(meta.exif).toBeUndefined(); // no EXIF block at all: GPS gone with it
    expect(meta.orientation).toBeUndefined();
    expect(hasGpsTag(stored.subarray(0, 2048))).toBe(false);
  });

  it('refuses other types (415), files over 25 MB (413), over 50 megapixels (413), broken files (422); nothing stored', async () => {
    const count = async () => (await db().selectFrom('uploads').select('id').execute()).length;
    const before = await count();
    const text = await upload(Buffer.from('Kettle Crab notes, not a picture'), 'notes.png');
    expect(text.status).toBe(415);
    const big = Buffer.alloc(26 * 1024 * 1024, 1);
    expect((await upload(big, 'huge.png')).status).toBe(413);
    const bomb = await sharp({ create: { width: 8000, height: 6300, channels: 3, background: '#fff' } })
      .png({ compressionLevel: 9 })
      .toBuffer();
    const b = await upload(bomb, 'bomb.png');
    expect(b.status).toBe(413);
    expect(b.body.error).toMatch(/50 megapixels/);
    const good = await png(20, 20);
    const broken = Buffer.concat([good.subarray(0, 40), Buffer.alloc(200, 7)]);
    expect((await upload(broken, 'broken.png')).status).toBe(422);
    expect(await count()).toBe(before);
  });

  it('a viewer cannot upload; another series’ member gets 404 on the file', async () => {
    expect((await upload(await png(10, 10), 'v.png', 'viewer')).status).toBe(403);
    const mine = await upload(await png(12, 12), 'mine.png');
    expect((await variant(mine.body.id, 'working', 'outsider')).status).toBe(404);
    expect((await variant(mine.body.id, 'working', 'editor')).status).toBe(200);
    expect((await variant(mine.body.id, 'thumbnail', 'editor')).status).toBe(404);
  });

  it('co-creators delete an upload', async () => {
    const u = await upload(await png(13, 13), 'gone.png');
    const headers = new Headers({ cookie: (await sessionCookie('owner'))! });
    const res = await uploadRoute.DELETE(new Request('http://localhost/x', { method: 'DELETE', headers }), {
      params: Promise.resolve({ uploadId: u.body.id }),
    });
    expect(res.status).toBe(204);
    expect((await variant(u.body.id, 'original')).status).toBe(404);
  });
});

describe('print check', () => {
  it('an image 1771 px wide filling a 150 mm trim is about 300 ppi (1 in = 25.4 mm exactly)', () => {
    // 1771 / (150 / 25.4) = 299.89
    expect(effectivePpi(1771, 150)).toBeCloseTo(299.89, 2);
  });
});

describe('the S3 fake at start-up', () => {
  it('refuses at once when its port is taken, instead of hanging the server', async () => {
    const net = await import('node:net');
    const { startFakeS3 } = await import('@/lib/storage/fake-s3');
    const holder = net.createServer();
    await new Promise<void>((r) => holder.listen(0, '127.0.0.1', () => r()));
    const port = (holder.address() as import('node:net').AddressInfo).port;
    await expect(startFakeS3(port)).rejects.toMatchObject({ code: 'EADDRINUSE' });
    await new Promise<void>((r) => holder.close(() => r()));
  });
});
