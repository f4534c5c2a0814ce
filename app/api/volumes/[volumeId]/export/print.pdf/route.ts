// The print file in one request, for scripts: starts (or joins) the job, waits for it and sends the
// file. 409 with the pages that lack their scans; `?proof=1` (the owner) builds a proof anyway.
// The volume page starts the same job and shows its progress instead (POST …/print-jobs).
import { printFileRoute } from '@/lib/export/print-route';

export const GET = printFileRoute('print');
