'use client';
// One volume: running order, flatplan, print spec, planner and exports.
import Link from 'next/link';
import useSWR from 'swr';
import type { EntryDto, Flatplan, VolumeDto } from '@/db/queries/volumes';
import { type Role, can } from '@/lib/auth/permissions';
import type { GagStatus } from '@/lib/gags/status';
import { api, fetcher } from '@/lib/http/client';
import { Exports } from './exports';
import { FlatplanView } from './flatplan';
import { type PlanData, Planner } from './planner';
import { RunningOrder } from './running-order';
import { VolumeSpecForm } from './volume-spec-form';

type VolumeData = VolumeDto & { entries: EntryDto[]; unplaced: { id: string; title: string; status: GagStatus }[] };

export function VolumePage({ seriesId, seriesTitle, role, initial }: { seriesId: string; seriesTitle: string; role: Role; initial: VolumeData }) {
  const vol = useSWR<VolumeData>(`/api/volumes/${initial.id}`, fetcher, { fallbackData: initial });
  const flat = useSWR<Flatplan>(`/api/volumes/${initial.id}/flatplan`, fetcher);
  const plan = useSWR<PlanData>(`/api/volumes/${initial.id}/plan`, fetcher);
  const v = vol.data ?? initial;
  const refresh = async (next?: EntryDto[]) => {
    if (next) await vol.mutate({ ...v, entries: next }, { revalidate: false });
    else await Promise.all([vol.mutate(), flat.mutate(), plan.mutate()]);
  };
  const patch = async (body: Record<string, unknown>) => {
    await api(`/api/volumes/${v.id}`, { method: 'PATCH', json: body });
    await Promise.all([vol.mutate(), flat.mutate(), plan.mutate()]);
  };
  return (
    <div className="space-y-8">
      <div>
        <p className="text-sm text-graphite-faint">
          <Link href={`/series/${seriesId}`} className="hover:underline">
            {seriesTitle}
          </Link>{' '}
          / volume
        </p>
        <h1 className="text-3xl font-extrabold">{v.title}</h1>
        <p className="text-sm text-graphite-soft">
          Due {v.deadline} · {v.spec.trimW} × {v.spec.trimH} mm · {v.spec.binding === 'saddle' ? 'saddle stitched' : 'perfect bound'}
        </p>
      </div>
      <RunningOrder volumeId={v.id} entries={v.entries} unplaced={v.unplaced} canEdit={can(role, 'edit')} onChanged={refresh} />
      {flat.data && <FlatplanView data={flat.data} binding={v.spec.binding} />}
      {plan.data && <Planner data={plan.data} canEdit={can(role, 'manage')} onPatch={patch} />}
      <VolumeSpecForm
        key={JSON.stringify(v.spec)}
        spec={v.spec}
        pages={v.entries.length}
        canEdit={can(role, 'manage')}
        onSave={(spec) => patch({ spec })}
      />
      <Exports volumeId={v.id} />
    </div>
  );
}
