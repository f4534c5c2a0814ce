// The database's shape as the app sees it (camelCase; columns are snake_case,
// mapped by Kysely's CamelCasePlugin). Migrations never import this file.
import type { ColumnType, Generated, Selectable } from 'kysely';
import type { BeatKind, GagStatus } from '@/lib/gags/status';
import type { Role } from '@/lib/auth/permissions';
import type { RoomShape, StrokeTool } from '@/lib/strokes/types';
import type { ScanColour } from '@/lib/print/final-fit';

/** ISO-8601 timestamps, stored as TEXT. */
type Timestamp = string;

export interface UsersTable {
  id: string;
  email: string;
  name: string;
  passwordHash: string;
  /** 1 = send me e-mail notifications (mentions, stamps on my gags). */
  notifyEmail: ColumnType<number, number | undefined, number>;
  createdAt: Timestamp;
}

export interface SeriesTable {
  id: string;
  title: string;
  /** JSON of a PageSpec; null means the default spec. */
  pageSpec: ColumnType<string | null, string | null | undefined, string | null>;
  /** Ink load above this share of a panel is flagged (default 0.35). */
  inkThreshold: ColumnType<number, number | undefined, number>;
  createdAt: Timestamp;
}

export interface MembershipsTable {
  seriesId: string;
  userId: string;
  role: Role;
  createdAt: Timestamp;
}

export interface GagsTable {
  id: string;
  seriesId: string;
  title: string;
  premise: string;
  status: GagStatus;
  /** Order on the board; fractional so a move rewrites one row. */
  position: number;
  /** Who started the gag: told when it is stamped. */
  createdBy: ColumnType<string | null, string | null | undefined, string | null>;
  createdAt: Timestamp;
  updatedAt: Timestamp;
}

export interface BeatsTable {
  gagId: string;
  kind: BeatKind;
  note: string;
  updatedAt: Timestamp;
}

export interface SignInFailuresTable {
  id: Generated<number>;
  email: string;
  /** Milliseconds since the epoch, so the window check is a plain comparison. */
  at: ColumnType<number, number, never>;
}

/** One sign-in: the session cookie names its row, and a request is signed in only while the row is there. */
export interface SessionsTable {
  id: string;
  userId: string;
  createdAt: Timestamp;
  /** The session ends at this time (30 days after sign-in) even if nobody signs out. */
  expiresAt: Timestamp;
}

/** A password check from one client address (see lib/auth/client-address.ts), counted before the hash. */
export interface SignInClientAttemptsTable {
  id: Generated<number>;
  client: string;
  /** Milliseconds since the epoch. */
  at: ColumnType<number, number, never>;
}

export interface PassesTable {
  id: string;
  gagId: string;
  number: number;
  /** Sequence number of the last accepted batch; 0 for a blank new pass. */
  seq: number;
  copiedFrom: number | null;
  createdBy: string | null;
  createdAt: Timestamp;
  updatedAt: Timestamp;
  /** Live strokes and their points (db/queries/pass-size.ts), for the size limit. */
  liveStrokes: Generated<number>;
  livePoints: Generated<number>;
}

/** One version of a stroke; a stroke id may have several rows over time, one live at most. */
export interface StrokesTable {
  rowId: Generated<number>;
  passId: string;
  strokeId: string;
  panel: number;
  tool: StrokeTool;
  grey: number;
  size: number;
  points: Buffer;
  pointCount: number;
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
  ox: ColumnType<number, number | undefined, number>;
  oy: ColumnType<number, number | undefined, number>;
  addedSeq: number;
  removedSeq: number | null;
  addedBy: string | null;
}

export interface StrokeMovesTable {
  id: Generated<number>;
  rowId: number;
  passId: string;
  seq: number;
  dx: number;
  dy: number;
}

export interface StrokeTombstonesTable {
  passId: string;
  strokeId: string;
  seq: number;
}

export interface RoomsTable {
  rowId: Generated<number>;
  passId: string;
  roomId: string;
  panel: number;
  shape: RoomShape;
  x: number;
  y: number;
  w: number;
  h: number;
  addedSeq: number;
  removedSeq: number | null;
}

export interface RoomTombstonesTable {
  passId: string;
  roomId: string;
  seq: number;
}

export interface LightboxesTable {
  rowId: Generated<number>;
  passId: string;
  lightboxId: string;
  uploadId: string;
  /** null: the whole page. */
  panel: number | null;
  x: number;
  y: number;
  w: number;
  h: number;
  rotation: number;
  opacity: number;
  /** 0 hidden, 1 shown. */
  visible: number;
  addedSeq: number;
  removedSeq: number | null;
}

export interface LightboxTombstonesTable {
  passId: string;
  lightboxId: string;
  seq: number;
}

export interface PassBatchesTable {
  passId: string;
  batchId: string;
  seq: number;
  userId: string | null;
  opCount: number;
  /** The JSON answered the first time; answered again for a replay. */
  result: string;
  createdAt: Timestamp;
}

export interface RevisionsTable {
  id: string;
  passId: string;
  seq: number;
  reason: RevisionReason;
  restoredFrom: string | null;
  userId: string | null;
  createdAt: Timestamp;
}

export type RevisionReason = 'created' | 'copied' | 'pause' | 'steady' | 'before-restore' | 'restore';

export interface ChecklistItemsTable {
  id: string;
  seriesId: string;
  text: string;
  position: number;
  createdAt: Timestamp;
  removedAt: Timestamp | null;
}

export interface ChecklistTicksTable {
  passId: string;
  itemId: string;
  userId: string;
  tickedAt: Timestamp;
}

/** An item ticked on an earlier pass, carried to this one as "to re-check" until it is ticked here. */
export interface ChecklistRechecksTable {
  passId: string;
  itemId: string;
  fromPassId: string;
  carriedBy: string;
  carriedAt: Timestamp;
}

export type { StampDecision } from '@/lib/review/words';
import type { CommentTarget, StampDecision } from '@/lib/review/words';
import type { EntryKind } from '@/lib/print/matter';
export type { CommentTarget, EntryKind };

export interface StampsTable {
  id: string;
  passId: string;
  gagId: string;
  decision: StampDecision;
  note: string;
  /** The pass's sequence number the stamp approved. */
  passSeq: number;
  userId: string;
  createdAt: Timestamp;
  clearedAt: Timestamp | null;
  clearedSeq: number | null;
}

export interface CommentsTable {
  id: string;
  gagId: string;
  parentId: string | null;
  target: CommentTarget;
  passId: string | null;
  panel: number | null;
  beat: BeatKind | null;
  x: number | null;
  y: number | null;
  body: string;
  authorId: string;
  createdAt: Timestamp;
  editedAt: Timestamp | null;
  resolvedAt: Timestamp | null;
  resolvedBy: string | null;
}

export interface ActivityTable {
  id: Generated<number>;
  seriesId: string;
  gagId: string | null;
  passId: string | null;
  userId: string | null;
  kind: string;
  summary: string;
  createdAt: Timestamp;
}

export interface InvitationsTable {
  id: string;
  tokenHash: string;
  seriesId: string;
  email: string;
  role: Role;
  invitedBy: string;
  createdAt: Timestamp;
  expiresAt: Timestamp;
  acceptedAt: Timestamp | null;
  acceptedBy: string | null;
  revokedAt: Timestamp | null;
  /** The invitation sent again in its place (revokedAt is set too); null otherwise. */
  replacedBy: ColumnType<string | null, string | null | undefined, string | null>;
  /** 0: only the account with `email` may accept; 1: anyone with the link (the owner chose it). */
  anyoneWithLink: ColumnType<number, number | undefined, number>;
}

export interface MailLogTable {
  id: Generated<number>;
  to: string;
  subject: string;
  kind: string;
  messageId: string | null;
  error: string | null;
  createdAt: Timestamp;
}

export interface PresenceTabsTable {
  tabId: string;
  userId: string;
  gagId: string;
  /** The live stream that holds the row ('poll' for a tab without one). */
  connId: ColumnType<string, string | undefined, string>;
  /** "page", "compare" or "pass:N". */
  where: string;
  /** The panel (0–3) the person is working on in the editor, if any. */
  panel: number | null;
  seenAt: Timestamp;
}

export interface VolumesTable {
  id: string;
  seriesId: string;
  title: string;
  /** YYYY-MM-DD */
  deadline: string;
  hoursPerWeek: number;
  /** JSON of a VolumeSpec. */
  spec: string;
  /** JSON of hours per page per stage. */
  hoursPerPage: string;
  createdAt: Timestamp;
}

export interface VolumeEntriesTable {
  id: string;
  volumeId: string;
  kind: EntryKind;
  gagId: string | null;
  /** Fractional order key (fractional-indexing). */
  position: string;
  createdAt: Timestamp;
  /** When a matter page was marked done (null: still to make; always null for a gag's page). */
  doneAt: Timestamp | null;
}

export interface UploadsTable {
  id: string;
  seriesId: string;
  sha256: string;
  name: string;
  mime: 'image/png' | 'image/jpeg' | 'image/webp';
  bytes: number;
  width: number;
  height: number;
  originalKey: string;
  workingKey: string;
  previewKey: string;
  createdBy: string;
  createdAt: Timestamp;
}

export type FinalPageColour = ScanColour;

/** A print file or cover file being built or built (db/queries/print-jobs.ts). */
export interface PrintJobsTable {
  id: string;
  volumeId: string;
  kind: 'print' | 'cover';
  proof: Generated<number>;
  state: 'queued' | 'running' | 'done' | 'failed';
  done: Generated<number>;
  total: Generated<number>;
  stage: Generated<string>;
  message: string | null;
  notes: Generated<string>;
  objectKey: string | null;
  bytes: number | null;
  pages: number | null;
  requestedBy: string;
  createdAt: Timestamp;
  heartbeatAt: number;
  finishedAt: Timestamp | null;
}

/** A scan of an inked page (a gag's or a matter page's); see db/queries/final-pages.ts. */
export interface FinalPagesTable {
  id: string;
  seriesId: string;
  /** Exactly one of gagId and entryId (a matter page) is set. */
  gagId: string | null;
  entryId: string | null;
  sha256: string;
  name: string;
  /** The file as uploaded. */
  mime: 'image/tiff' | 'image/png' | 'image/jpeg';
  bytes: number;
  width: number;
  height: number;
  bitsPerPixel: number;
  colour: FinalPageColour;
  /** The resolution the file records, if any (pixels per inch). */
  ppi: number | null;
  /** The file kept for printing: the same pixels, upright, private metadata gone. */
  keptKey: string;
  keptMime: string;
  /** A copy at most 2,048 px for the screen, and a 320 px preview. */
  displayKey: string;
  previewKey: string;
  fitTo: 'trim' | 'bleed';
  fitX: number;
  fitY: number;
  fitScale: number;
  fitRotation: number;
  /** Set when a person fitted it (PUT …/fit); null while it has the fit it got on upload. */
  fittedAt: Timestamp | null;
  fittedBy: string | null;
  /** 1 for the current final page of its gag or matter page. */
  current: number;
  madeCurrentAt: Timestamp;
  madeCurrentBy: string;
  createdBy: string;
  createdAt: Timestamp;
}

/** A final page's measured pixels (lib/print/scan-analysis.ts), one per analysis version. */
export interface FinalPageAnalysesTable {
  finalPageId: string;
  version: number;
  width: number;
  height: number;
  cell: number;
  cols: number;
  rows: number;
  ink: Buffer;
  colour: Buffer;
  colourPixels: number;
  createdAt: Timestamp;
}

export interface Database {
  users: UsersTable;
  series: SeriesTable;
  memberships: MembershipsTable;
  gags: GagsTable;
  beats: BeatsTable;
  signInFailures: SignInFailuresTable;
  signInClientAttempts: SignInClientAttemptsTable;
  sessions: SessionsTable;
  passes: PassesTable;
  strokes: StrokesTable;
  strokeMoves: StrokeMovesTable;
  strokeTombstones: StrokeTombstonesTable;
  rooms: RoomsTable;
  roomTombstones: RoomTombstonesTable;
  lightboxes: LightboxesTable;
  lightboxTombstones: LightboxTombstonesTable;
  passBatches: PassBatchesTable;
  revisions: RevisionsTable;
  checklistItems: ChecklistItemsTable;
  checklistTicks: ChecklistTicksTable;
  checklistRechecks: ChecklistRechecksTable;
  stamps: StampsTable;
  comments: CommentsTable;
  activity: ActivityTable;
  invitations: InvitationsTable;
  mailLog: MailLogTable;
  presenceTabs: PresenceTabsTable;
  volumes: VolumesTable;
  volumeEntries: VolumeEntriesTable;
  uploads: UploadsTable;
  finalPages: FinalPagesTable;
  finalPageAnalyses: FinalPageAnalysesTable;
  printJobs: PrintJobsTable;
}

export type User = Selectable<UsersTable>;
export type Gag = Selectable<GagsTable>;
export type Beat = Selectable<BeatsTable>;
