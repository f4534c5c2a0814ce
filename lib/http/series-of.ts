// How a route finds the series its resource belongs to (null → 404), for
// withSeriesRole. One resolver per kind of id in the URL.
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { seriesOfComment } from '@/db/queries/comments';
import { seriesOfFinalPage } from '@/db/queries/final-pages';
import { seriesOfGag } from '@/db/queries/gags';
import { seriesOfPass } from '@/db/queries/passes';
import { seriesOfPrintJob } from '@/db/queries/print-jobs';
import { seriesOfUpload } from '@/db/queries/uploads';
import { seriesOfVolume } from '@/db/queries/volumes';

type Db = Kysely<Database>;

// The series is its own id: one that does not exist has no members, so the role check answers 404 as for a non-member.
export const bySeriesId = async (p: { seriesId: string }) => p.seriesId;
export const byGagId = (p: { gagId: string }, db: Db) => seriesOfGag(db, p.gagId);
export const byPassId = (p: { passId: string }, db: Db) => seriesOfPass(db, p.passId);
export const byVolumeId = (p: { volumeId: string }, db: Db) => seriesOfVolume(db, p.volumeId);
export const byUploadId = (p: { uploadId: string }, db: Db) => seriesOfUpload(db, p.uploadId);
export const byCommentId = (p: { commentId: string }, db: Db) => seriesOfComment(db, p.commentId);
export const byFinalPageId = (p: { finalPageId: string }, db: Db) => seriesOfFinalPage(db, p.finalPageId);
export const byPrintJobId = (p: { jobId: string }, db: Db) => seriesOfPrintJob(db, p.jobId);
