// The database's shape as the app sees it (camelCase; columns are snake_case,
// mapped by Kysely's CamelCasePlugin). Migrations never import this file.
import type { ColumnType, Generated, Insertable, Selectable, Updateable } from 'kysely';
import type { BeatKind, GagStatus } from '@/lib/gags/status';
import type { Role } from '@/lib/auth/permissions';

/** ISO-8601 timestamps, stored as TEXT. */
type Timestamp = string;

export interface UsersTable {
  id: string;
  email: string;
  name: string;
  passwordHash: string;
  createdAt: Timestamp;
}

export interface SeriesTable {
  id: string;
  title: string;
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

export interface Database {
  users: UsersTable;
  series: SeriesTable;
  memberships: MembershipsTable;
  gags: GagsTable;
  beats: BeatsTable;
  signInFailures: SignInFailuresTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type Gag = Selectable<GagsTable>;
export type GagUpdate = Updateable<GagsTable>;
export type Beat = Selectable<BeatsTable>;
