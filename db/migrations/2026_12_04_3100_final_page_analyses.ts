import type { Kysely } from 'kysely';
import { columnTypes } from '../dialect';

// What the preflight measured of a final page's pixels (lib/print/scan-analysis.ts), kept
// once per final page and analysis version: the scan never changes, so neither does this,
// and every instance reads the same result instead of measuring again.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('final_page_analyses')
    .addColumn('final_page_id', 'text', (c) => c.notNull().references('final_pages.id').onDelete('cascade'))
    .addColumn('version', 'integer', (c) => c.notNull())
    .addColumn('width', 'integer', (c) => c.notNull())
    .addColumn('height', 'integer', (c) => c.notNull())
    .addColumn('cell', 'integer', (c) => c.notNull())
    .addColumn('cols', 'integer', (c) => c.notNull())
    .addColumn('rows', 'integer', (c) => c.notNull())
    .addColumn('ink', t.bytes, (c) => c.notNull())
    .addColumn('colour', t.bytes, (c) => c.notNull())
    .addColumn('colour_pixels', t.epochMs, (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('final_page_analyses_pk', ['final_page_id', 'version'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('final_page_analyses').execute();
}
