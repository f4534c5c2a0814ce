import { type Kysely, sql } from 'kysely';
import { autoId, columnTypes } from '../dialect';

// The review loop: checklist, stamps, comments, activity, invitations, mail log,
// presence, and per-person notification settings.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema
    .alterTable('series')
    .addColumn('ink_threshold', t.float, (c) => c.notNull().defaultTo(0.35))
    .execute();
  await db.schema.alterTable('gags').addColumn('created_by', 'text').execute();
  await db.schema
    .alterTable('users')
    .addColumn('notify_email', 'integer', (c) => c.notNull().defaultTo(1))
    .execute();

  await db.schema
    .createTable('checklist_items')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('position', t.float, (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('removed_at', 'text')
    .execute();
  await db.schema.createIndex('checklist_items_series_idx').on('checklist_items').columns(['series_id', 'position']).execute();

  await db.schema
    .createTable('checklist_ticks')
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('item_id', 'text', (c) => c.notNull().references('checklist_items.id').onDelete('cascade'))
    .addColumn('user_id', 'text', (c) => c.notNull())
    .addColumn('ticked_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('checklist_ticks_pk', ['pass_id', 'item_id'])
    .execute();

  await db.schema
    .createTable('stamps')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('gag_id', 'text', (c) => c.notNull().references('gags.id').onDelete('cascade'))
    .addColumn('decision', 'text', (c) => c.notNull().check(sql`decision in ('ready', 'again')`))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('pass_seq', 'integer', (c) => c.notNull())
    .addColumn('user_id', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('cleared_at', 'text')
    .addColumn('cleared_seq', 'integer')
    .execute();
  await db.schema.createIndex('stamps_pass_idx').on('stamps').columns(['pass_id', 'created_at']).execute();
  await db.schema.createIndex('stamps_gag_idx').on('stamps').columns(['gag_id', 'created_at']).execute();

  await db.schema
    .createTable('comments')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('gag_id', 'text', (c) => c.notNull().references('gags.id').onDelete('cascade'))
    .addColumn('parent_id', 'text', (c) => c.references('comments.id').onDelete('cascade'))
    .addColumn('target', 'text', (c) => c.notNull().check(sql`target in ('gag', 'pass', 'panel', 'beat', 'point')`))
    .addColumn('pass_id', 'text', (c) => c.references('passes.id').onDelete('cascade'))
    .addColumn('panel', 'integer')
    .addColumn('beat', 'text')
    .addColumn('x', t.float)
    .addColumn('y', t.float)
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('author_id', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('edited_at', 'text')
    .addColumn('resolved_at', 'text')
    .addColumn('resolved_by', 'text')
    .execute();
  await db.schema.createIndex('comments_gag_idx').on('comments').columns(['gag_id', 'created_at']).execute();

  await db.schema
    .createTable('activity')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('gag_id', 'text')
    .addColumn('pass_id', 'text')
    .addColumn('user_id', 'text')
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('summary', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('activity_series_idx').on('activity').columns(['series_id', 'id']).execute();

  await db.schema
    .createTable('invitations')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('series_id', 'text', (c) => c.notNull().references('series.id').onDelete('cascade'))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('owner', 'cocreator', 'editor', 'viewer')`))
    .addColumn('invited_by', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .addColumn('accepted_at', 'text')
    .addColumn('accepted_by', 'text')
    .addColumn('revoked_at', 'text')
    .execute();

  await db.schema
    .createTable('mail_log')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('to', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('message_id', 'text')
    .addColumn('error', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('presence')
    .addColumn('scope', 'text', (c) => c.notNull())
    .addColumn('user_id', 'text', (c) => c.notNull())
    .addColumn('seen_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('presence_pk', ['scope', 'user_id'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['presence', 'mail_log', 'invitations', 'activity', 'comments', 'stamps', 'checklist_ticks', 'checklist_items']) {
    await db.schema.dropTable(t).execute();
  }
  await db.schema.alterTable('users').dropColumn('notify_email').execute();
  await db.schema.alterTable('gags').dropColumn('created_by').execute();
  await db.schema.alterTable('series').dropColumn('ink_threshold').execute();
}
