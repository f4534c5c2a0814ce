import type { Kysely } from 'kysely';

// An invitation sent again is a new invitation (a fresh link: only a link's hash is kept, so the old one
// cannot be mailed twice); the old row is withdrawn and names the one that replaced it, so its link can
// say "use the newer e-mail" rather than "unknown".
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('invitations').addColumn('replaced_by', 'text').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('invitations').dropColumn('replaced_by').execute();
}
