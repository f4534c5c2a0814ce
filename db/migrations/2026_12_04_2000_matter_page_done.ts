import type { Kysely } from 'kysely';

// A matter page (cover, title page, afterword…) can be marked done, so the planner
// counts its hours until it is; a gag's page is done by its status instead.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('volume_entries').addColumn('done_at', 'text').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('volume_entries').dropColumn('done_at').execute();
}
