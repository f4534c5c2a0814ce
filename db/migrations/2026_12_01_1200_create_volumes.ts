import { type Kysely, sql } from 'kysely';
import { byteOrdered, columnTypes } from '../dialect';

// Volumes with their print spec and running order (fractional order keys, so a
// move rewrites one row). A gag is placed at most once.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('volumes')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('deadline', 'text', (c) => c.notNull())
    .addColumn('hours_per_week', t.float, (c) => c.notNull().defaultTo(6))
    .addColumn('spec', 'text', (c) => c.notNull())
    .addColumn('hours_per_page', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('volume_entries')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('volume_id', 'text', (c) => c.notNull().references('volumes.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) =>
      c.notNull().check(sql`kind in ('gag', 'cover', 'inside-cover', 'title', 'credits', 'blank', 'afterword', 'inside-back', 'back-cover')`),
    )
    .addColumn('gag_id', 'text', (c) => c.references('gags.id').onDelete('cascade'))
    .addColumn('position', 'text', (c) => byteOrdered(db)(c).notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('volume_entries_order_idx').on('volume_entries').columns(['volume_id', 'position']).execute();
  await sql`create unique index volume_entries_gag_uq on volume_entries (gag_id) where gag_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('volume_entries').execute();
  await db.schema.dropTable('volumes').execute();
}
