import type { Kysely } from 'kysely';
import { columnTypes } from '../dialect';

// The print file and the cover file are built as jobs: a row any instance can read
// (its state and progress), the work in one instance's worker pool, the file in
// object storage. The instance building a job beats its heartbeat; a job whose
// heartbeat stops (its server went away) reads as failed everywhere.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('print_jobs')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('volume_id', 'text', (c) => c.notNull().references('volumes.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull()) // print | cover
    .addColumn('proof', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('state', 'text', (c) => c.notNull()) // queued | running | done | failed
    .addColumn('done', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('total', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('stage', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('message', 'text')
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo('[]')) // JSON: what the file changed (e.g. colour made grey)
    .addColumn('object_key', 'text')
    .addColumn('bytes', t.epochMs)
    .addColumn('pages', 'integer')
    .addColumn('requested_by', 'text', (c) => c.notNull().references('users.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('heartbeat_at', t.epochMs, (c) => c.notNull())
    .addColumn('finished_at', 'text')
    .execute();
  await db.schema.createIndex('print_jobs_volume').on('print_jobs').columns(['volume_id', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('print_jobs').execute();
}
