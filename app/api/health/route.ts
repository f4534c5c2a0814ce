import { sql } from 'kysely';
import { dbKind, getDb } from '@/db/client';

export const dynamic = 'force-dynamic';

export async function GET() {
  try {
    const db = await getDb();
    await sql`select 1`.execute(db);
    return Response.json({ ok: true, db: dbKind() });
  } catch {
    return Response.json({ ok: false, db: dbKind() }, { status: 503 });
  }
}
