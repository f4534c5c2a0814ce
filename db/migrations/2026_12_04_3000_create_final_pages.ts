import { type Kysely, sql } from 'kysely';
import { columnTypes } from '../dialect';

// Final pages: the scans of the inked, toned pages, one row per scan. A gag or a
// matter page (a running-order entry) has at most one current final page and keeps
// the earlier ones. The kept file lives in object storage under the keys recorded
// here; the fit places it on the page in mm (see lib/print/final-fit.ts).
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('final_pages')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('gag_id', 'text', (c) => c.references('gags.id').onDelete('cascade'))
    .addColumn('entry_id', 'text', (c) => c.references('volume_entries.id').onDelete('cascade'))
    .addColumn('sha256', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('mime', 'text', (c) => c.notNull().check(sql`mime in ('image/tiff', 'image/png', 'image/jpeg')`))
    .addColumn('bytes', 'integer', (c) => c.notNull())
    .addColumn('width', 'integer', (c) => c.notNull())
    .addColumn('height', 'integer', (c) => c.notNull())
    .addColumn('bits_per_pixel', 'integer', (c) => c.notNull())
    .addColumn('colour', 'text', (c) => c.notNull().check(sql`colour in ('grey', 'line', 'rgb')`))
    .addColumn('ppi', t.float)
    .addColumn('kept_key', 'text', (c) => c.notNull())
    .addColumn('kept_mime', 'text', (c) => c.notNull())
    .addColumn('display_key', 'text', (c) => c.notNull())
    .addColumn('preview_key', 'text', (c) => c.notNull())
    .addColumn('fit_to', 'text', (c) => c.notNull().check(sql`fit_to in ('trim', 'bleed')`))
    .addColumn('fit_x', t.float, (c) => c.notNull())
    .addColumn('fit_y', t.float, (c) => c.notNull())
    .addColumn('fit_scale', t.float, (c) => c.notNull())
    .addColumn('fit_rotation', 'integer', (c) => c.notNull().check(sql`fit_rotation in (0, 90, 180, 270)`))
    .addColumn('fitted_at', 'text')
    .addColumn('fitted_by', 'text')
    .addColumn('current', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('made_current_at', 'text', (c) => c.notNull())
    .addColumn('made_current_by', 'text', (c) => c.notNull())
    .addColumn('created_by', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    // A final page belongs to a gag or to a matter page, never both.
    .addCheckConstraint('final_pages_owner_ck', sql`(gag_id is null) <> (entry_id is null)`)
    .execute();
  await db.schema.createIndex('final_pages_gag_idx').on('final_pages').columns(['gag_id', 'created_at']).execute();
  await db.schema.createIndex('final_pages_entry_idx').on('final_pages').columns(['entry_id', 'created_at']).execute();
  // One current final page per gag and per matter page, whatever two instances do at once.
  await sql`create unique index final_pages_gag_current_uq on final_pages (gag_id) where current = 1 and gag_id is not null`.execute(db);
  await sql`create unique index final_pages_entry_current_uq on final_pages (entry_id) where current = 1 and entry_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('final_pages').execute();
}
