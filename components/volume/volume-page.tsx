'use client';
// One volume: running order, flatplan, print spec, planner and exports.
import Link from 'next/link';
import { type VolumeData, useVolume } from '@/hooks/use-volumes';
import { type Role, can } from '@/lib/auth/permissions';
import { Exports } from './exports';
import { FlatplanView } from './flatplan';
import { MatterFinalPages } from './matter-final-pages';
import { Planner } from './planner';
import { PreflightView } from './preflight-view';
import { PrintFilePanel } from './print-file-panel';
import { RunningOrder } from './running-order';
import { VolumeSpecForm } from './volume-spec-form';

export function VolumePage({ seriesId, seriesTitle, role, initial }: { seriesId: string; seriesTitle: string; role: Role; initial: VolumeData }) {
  const { volume: v, flatplan, plan, refresh, patch } = useVolume(initial);
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
      {flatplan && <FlatplanView data={flatplan} spec={v.spec} volumeId={v.id} />}
      <MatterFinalPages volumeId={v.id} entries={v.entries} spec={v.spec} canEdit={can(role, 'edit')} />
      <PreflightView volumeId={v.id} entries={v.entries} />
      <PrintFilePanel volumeId={v.id} binding={v.spec.binding} canPrint={can(role, 'print')} canProof={can(role, 'manage')} />
      {plan && <Planner data={plan} canEdit={can(role, 'manage')} onPatch={patch} />}
      <VolumeSpecForm
        key={JSON.stringify(v.spec)}
        spec={v.spec}
        pages={v.entries.length}
        canEdit={can(role, 'manage')}
        onSave={(spec) => patch({ spec })}
      />
      <Exports volumeId={v.id} entriesKey={v.entries.map((e) => `${e.id}:${e.status ?? ''}`).join(',')} />
    </div>
  );
}
