import { dbKind, getDb, ping } from '@/db/client';
import { sized } from '@/lib/http/sized';

export const dynamic = 'force-dynamic';

export async function GET() {
  try {
    const db = await getDb();
    await ping(db);
    return sized(Response.json({ ok: true, db: dbKind() }));
  } catch {
    return sized(Response.json({ ok: false, db: dbKind() }, { status: 503 }));
  }
}
