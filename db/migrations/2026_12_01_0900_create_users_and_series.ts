import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('users')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('series')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('memberships')
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('user_id', 'text', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('owner', 'cocreator', 'editor', 'viewer')`))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('memberships_pk', ['series_id', 'user_id'])
    .execute();
  await db.schema.createIndex('memberships_user_idx').on('memberships').column('user_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('memberships').execute();
  await db.schema.dropTable('series').execute();
  await db.schema.dropTable('users').execute();
}
