import { dbKind, getDb, ping } from '@/db/client';

export const dynamic = 'force-dynamic';

export async function GET() {
  try {
    const db = await getDb();
    await ping(db);
    return Response.json({ ok: true, db: dbKind() });
  } catch {
    return Response.json({ ok: false, db: dbKind() }, { status: 503 });
  }
}
