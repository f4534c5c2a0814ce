import type { Kysely } from 'kysely';
import { autoId, columnTypes } from '../dialect';

export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('sign_in_failures')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('at', t.epochMs, (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sign_in_failures_email_at_idx').on('sign_in_failures').columns(['email', 'at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('sign_in_failures').execute();
}
