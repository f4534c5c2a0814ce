import type { Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('sign_in_failures')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('at', 'integer', (c) => c.notNull())
    .execute();
  await db.schema
    .createIndex('sign_in_failures_email_at_idx')
    .on('sign_in_failures')
    .columns(['email', 'at'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('sign_in_failures').execute();
}
