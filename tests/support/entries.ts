// A running-order entry as the volume's answer gives it, for the tests of the pure running-order and
// preflight views: a gag's entry names its gag and a status, a matter page neither.
import type { EntryDto } from '@/db/queries/volumes';
import type { GagStatus } from '@/lib/gags/status';

export const entry = (id: string, kind: EntryDto['kind'], title: string | null = null, status: GagStatus = 'placed'): EntryDto => ({
  id,
  kind,
  gagId: kind === 'gag' ? `g-${id}` : null,
  position: id,
  title,
  status: kind === 'gag' ? status : null,
  latestPass: null,
  done: false,
});
