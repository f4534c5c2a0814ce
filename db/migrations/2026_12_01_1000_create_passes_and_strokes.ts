import { type Kysely, sql } from 'kysely';
import { autoId, columnTypes } from '../dialect';

// Passes and their append-only stroke model (see shared/STROKES.md):
// one row per stroke version, tombstones for removals, one row per move,
// a batch log for idempotent retries, and revisions to restore.
export async function up(db: Kysely<any>): Promise<void> {
  const t = columnTypes(db);
  await db.schema.alterTable('series').addColumn('page_spec', 'text').execute();

  await db.schema
    .createTable('passes')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('gag_id', 'text', (c) => c.notNull().references('gags.id').onDelete('cascade'))
    .addColumn('number', 'integer', (c) => c.notNull())
    .addColumn('seq', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('copied_from', 'integer')
    .addColumn('created_by', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('passes_gag_number_uq', ['gag_id', 'number'])
    .execute();

  await db.schema
    .createTable('strokes')
    .addColumn('row_id', 'integer', autoId(db))
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('stroke_id', 'text', (c) => c.notNull())
    .addColumn('panel', 'integer', (c) => c.notNull().check(sql`panel between 0 and 3`))
    .addColumn('tool', 'text', (c) => c.notNull().check(sql`tool in ('pen', 'tone')`))
    .addColumn('grey', 'integer', (c) => c.notNull())
    .addColumn('size', t.float, (c) => c.notNull())
    .addColumn('points', t.bytes, (c) => c.notNull())
    .addColumn('point_count', 'integer', (c) => c.notNull())
    // Bounds of the stored points (mm), before the move offset below.
    .addColumn('min_x', t.float, (c) => c.notNull())
    .addColumn('min_y', t.float, (c) => c.notNull())
    .addColumn('max_x', t.float, (c) => c.notNull())
    .addColumn('max_y', t.float, (c) => c.notNull())
    // Current offset, the sum of this row's stroke_moves.
    .addColumn('ox', t.float, (c) => c.notNull().defaultTo(0))
    .addColumn('oy', t.float, (c) => c.notNull().defaultTo(0))
    .addColumn('added_seq', 'integer', (c) => c.notNull())
    .addColumn('removed_seq', 'integer')
    .addColumn('added_by', 'text')
    .execute();
  await db.schema.createIndex('strokes_pass_stroke_idx').on('strokes').columns(['pass_id', 'stroke_id']).execute();
  await db.schema.createIndex('strokes_pass_added_idx').on('strokes').columns(['pass_id', 'added_seq']).execute();
  await db.schema.createIndex('strokes_pass_removed_idx').on('strokes').columns(['pass_id', 'removed_seq']).execute();

  await db.schema
    .createTable('stroke_moves')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('row_id', 'integer', (c) => c.notNull().references('strokes.row_id').onDelete('cascade'))
    .addColumn('pass_id', 'text', (c) => c.notNull())
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addColumn('dx', t.float, (c) => c.notNull())
    .addColumn('dy', t.float, (c) => c.notNull())
    .execute();
  await db.schema.createIndex('stroke_moves_row_idx').on('stroke_moves').columns(['row_id', 'seq']).execute();
  await db.schema.createIndex('stroke_moves_pass_idx').on('stroke_moves').columns(['pass_id', 'seq']).execute();

  await db.schema
    .createTable('stroke_tombstones')
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('stroke_id', 'text', (c) => c.notNull())
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addPrimaryKeyConstraint('stroke_tombstones_pk', ['pass_id', 'stroke_id'])
    .execute();

  await db.schema
    .createTable('rooms')
    .addColumn('row_id', 'integer', autoId(db))
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('room_id', 'text', (c) => c.notNull())
    .addColumn('panel', 'integer', (c) => c.notNull().check(sql`panel between 0 and 3`))
    .addColumn('shape', 'text', (c) => c.notNull().check(sql`shape in ('rect', 'ellipse')`))
    .addColumn('x', t.float, (c) => c.notNull())
    .addColumn('y', t.float, (c) => c.notNull())
    .addColumn('w', t.float, (c) => c.notNull())
    .addColumn('h', t.float, (c) => c.notNull())
    .addColumn('added_seq', 'integer', (c) => c.notNull())
    .addColumn('removed_seq', 'integer')
    .execute();
  await db.schema.createIndex('rooms_pass_room_idx').on('rooms').columns(['pass_id', 'room_id']).execute();

  await db.schema
    .createTable('room_tombstones')
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('room_id', 'text', (c) => c.notNull())
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addPrimaryKeyConstraint('room_tombstones_pk', ['pass_id', 'room_id'])
    .execute();

  await db.schema
    .createTable('pass_batches')
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('batch_id', 'text', (c) => c.notNull())
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addColumn('user_id', 'text')
    .addColumn('op_count', 'integer', (c) => c.notNull())
    .addColumn('result', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('pass_batches_pk', ['pass_id', 'batch_id'])
    .execute();

  await db.schema
    .createTable('revisions')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('pass_id', 'text', (c) => c.notNull().references('passes.id').onDelete('cascade'))
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('restored_from', 'text')
    .addColumn('user_id', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('revisions_pass_seq_idx').on('revisions').columns(['pass_id', 'seq']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['revisions', 'pass_batches', 'room_tombstones', 'rooms', 'stroke_tombstones', 'stroke_moves', 'strokes', 'passes']) {
    await db.schema.dropTable(t).execute();
  }
  await db.schema.alterTable('series').dropColumn('page_spec').execute();
}
