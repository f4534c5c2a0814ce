import type { Kysely } from 'kysely';
import { autoId, columnTypes } from '../dialect';

// Sign-in hardening (issue 13):
// - sessions: each sign-in is a row; the session cookie names it, and every request checks it is still there,
//   so signing out, a password change or removal from one's last series ends a session on the server.
// - sign_in_client_attempts: password checks per client address, counted before the hash (at most 30 in 15 min).
// - invitations.anyone_with_link: 0 (the default) ties an invitation to its e-mail address; 1 is an open link
//   the owner chose on purpose.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .createTable('sessions')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('user_id', 'text', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sessions_user_idx').on('sessions').column('user_id').execute();

  await db.schema
    .createTable('sign_in_client_attempts')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('client', 'text', (c) => c.notNull())
    .addColumn('at', t.epochMs, (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sign_in_client_attempts_client_at_idx').on('sign_in_client_attempts').columns(['client', 'at']).execute();

  await db.schema
    .alterTable('invitations')
    .addColumn('anyone_with_link', 'integer', (c) => c.notNull().defaultTo(0))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('invitations').dropColumn('anyone_with_link').execute();
  await db.schema.dropTable('sign_in_client_attempts').execute();
  await db.schema.dropTable('sessions').execute();
}
