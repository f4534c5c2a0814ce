import type { Kysely } from 'kysely';

// Scans and photos for the lightbox. One row per distinct file per series (by SHA-256);
// the bytes live in object storage under the keys recorded here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('uploads')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('sha256', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('mime', 'text', (c) => c.notNull())
    .addColumn('bytes', 'integer', (c) => c.notNull())
    .addColumn('width', 'integer', (c) => c.notNull())
    .addColumn('height', 'integer', (c) => c.notNull())
    .addColumn('original_key', 'text', (c) => c.notNull())
    .addColumn('working_key', 'text', (c) => c.notNull())
    .addColumn('preview_key', 'text', (c) => c.notNull())
    .addColumn('created_by', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('uploads_series_sha_uq', ['series_id', 'sha256'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('uploads').execute();
}
