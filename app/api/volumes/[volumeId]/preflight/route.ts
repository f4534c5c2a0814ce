// The volume's preflight: every page in running order and the book, each check with its rule and source.
// Measuring a scan's pixels runs in the worker pool the first time and is kept per final page.
import { withSeriesRole } from '@/lib/http/route';
import { byVolumeId } from '@/lib/http/series-of';
import { volumePreflight } from '@/lib/export/volume-preflight';

type Params = { volumeId: string };
const seriesOf = byVolumeId;

export const GET = withSeriesRole<Params>('read', seriesOf, async ({ db, params }) => Response.json(await volumePreflight(db, params.volumeId)));
