import type { Kysely } from 'kysely';

// Presence per open tab (a person may have a gag open twice), with the panel
// they are on. The stream that holds a tab open refreshes its row and deletes it
// when the tab goes away; rows of a tab lost with its instance expire by seen_at.
// The old per-person table held only heartbeats, nothing worth keeping.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('presence').execute();
  await db.schema
    .createTable('presence_tabs')
    .addColumn('tab_id', 'text', (c) => c.notNull())
    .addColumn('user_id', 'text', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('gag_id', 'text', (c) => c.notNull().references('gags.id').onDelete('cascade'))
    // The stream that holds the row; 'poll' for a tab without one.
    .addColumn('conn_id', 'text', (c) => c.notNull().defaultTo('poll'))
    .addColumn('where', 'text', (c) => c.notNull())
    .addColumn('panel', 'integer')
    .addColumn('seen_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('presence_tabs_pk', ['tab_id', 'user_id'])
    .execute();
  await db.schema.createIndex('presence_tabs_gag_idx').on('presence_tabs').columns(['gag_id', 'seen_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('presence_tabs').execute();
  await db.schema
    .createTable('presence')
    .addColumn('scope', 'text', (c) => c.notNull())
    .addColumn('user_id', 'text', (c) => c.notNull())
    .addColumn('seen_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('presence_pk', ['scope', 'user_id'])
    .execute();
}
