import { type Kysely, sql } from 'kysely';
import { autoId, columnTypes } from '../dialect';

// Lightboxes: an upload placed under a pass's strokes, on the whole page
// (panel null) or one panel. Kept like balloon rooms: one row per version,
// removed_seq when replaced or taken away, tombstones so "remove beats add".
// upload_id has no foreign key on purpose: the log outlives a deleted upload.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('lightboxes')
    .addColumn('row_id', 'integer', autoId(db))
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('lightbox_id', 'text', (c) => c.notNull())
    .addColumn('upload_id', 'text', (c) => c.notNull())
    .addColumn('panel', 'integer', (c) => c.check(sql`panel is null or panel between 0 and 3`))
    .addColumn('x', t.float, (c) => c.notNull())
    .addColumn('y', t.float, (c) => c.notNull())
    .addColumn('w', t.float, (c) => c.notNull())
    .addColumn('h', t.float, (c) => c.notNull())
    .addColumn('rotation', 'integer', (c) => c.notNull().check(sql`rotation in (0, 90, 180, 270)`))
    .addColumn('opacity', t.float, (c) => c.notNull().check(sql`opacity between 0 and 1`))
    .addColumn('visible', 'integer', (c) => c.notNull().check(sql`visible in (0, 1)`))
    .addColumn('added_seq', 'integer', (c) => c.notNull())
    .addColumn('removed_seq', 'integer')
    .execute();
  await db.schema.createIndex('lightboxes_pass_item_idx').on('lightboxes').columns(['pass_id', 'lightbox_id']).execute();
  await db.schema.createIndex('lightboxes_upload_idx').on('lightboxes').columns(['upload_id', 'removed_seq']).execute();

  await db.schema
    .createTable('lightbox_tombstones')
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('lightbox_id', 'text', (c) => c.notNull())
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addPrimaryKeyConstraint('lightbox_tombstones_pk', ['pass_id', 'lightbox_id'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('lightbox_tombstones').execute();
  await db.schema.dropTable('lightboxes').execute();
}
