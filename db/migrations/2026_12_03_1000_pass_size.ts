import { type Kysely, sql } from 'kysely';

// How much each pass holds (live strokes, their points), kept on the pass row so
// a batch checks the pass size limit without counting rows.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('passes')
    .addColumn('live_strokes', 'integer', (c) => c.notNull().defaultTo(0))
    .execute();
  await db.schema
    .alterTable('passes')
    .addColumn('live_points', 'integer', (c) => c.notNull().defaultTo(0))
    .execute();
  await sql`update passes set
    live_strokes = (select count(*) from strokes where strokes.pass_id = passes.id and strokes.removed_seq is null),
    live_points = (select coalesce(sum(point_count), 0) from strokes where strokes.pass_id = passes.id and strokes.removed_seq is null)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('passes').dropColumn('live_points').execute();
  await db.schema.alterTable('passes').dropColumn('live_strokes').execute();
}
