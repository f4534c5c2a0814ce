import type { Kysely } from 'kysely';

// Checklist items carried from an earlier pass as "to re-check": the item was ticked on that
// pass and has not been ticked on this one yet. Ticking it on this pass clears the mark.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('checklist_rechecks')
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('item_id', 'text', (c) => c.notNull().references('checklist_items.id').onDelete('cascade'))
    .addColumn('from_pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('carried_by', 'text', (c) => c.notNull())
    .addColumn('carried_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('checklist_rechecks_pk', ['pass_id', 'item_id'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('checklist_rechecks').execute();
}
