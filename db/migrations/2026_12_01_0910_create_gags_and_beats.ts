import { type Kysely, sql } from 'kysely';
import { columnTypes } from '../dialect';

export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('gags')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('premise', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('status', 'text', (c) =>
      c
        .notNull()
        .defaultTo('idea')
        .check(sql`status in ('idea', 'thumbnailing', 'in_review', 'ready_to_ink', 'inked', 'scanned', 'placed')`),
    )
    .addColumn('position', t.float, (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('gags_series_position_idx').on('gags').columns(['series_id', 'position']).execute();

  await db.schema
    .createTable('beats')
    .addColumn('gag_id', 'text', (c) => c.notNull().references('gags.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('setup', 'build', 'turn', 'payoff')`))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('beats_pk', ['gag_id', 'kind'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('beats').execute();
  await db.schema.dropTable('gags').execute();
}
