'use client';
// Hours left per stage against the deadline, and pages left week by week (recharts).
import { AlertTriangle, CalendarCheck } from 'lucide-react';
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { STAGES, STAGE_LABELS, type Plan, type Stage } from '@/lib/planning/plan';
import { counted } from '@/lib/counted';

export type PlanData = Plan & { deadline: string; hoursPerWeek: number; hoursPerPage: Record<Stage, number> };

export function Planner({
  data,
  canEdit,
  onPatch,
}: {
  data: PlanData;
  canEdit: boolean;
  onPatch: (patch: Record<string, unknown>) => Promise<void>;
}) {
  return (
    <section aria-labelledby="planner-title" className="space-y-3">
      <h2 id="planner-title" className="text-xl font-extrabold">
        Planner
      </h2>
      <div
        className={`flex items-start gap-2 rounded-md border px-3 py-2 text-sm ${data.late ? 'border-stamp/40 bg-stamp-light text-stamp' : 'border-paper-edge bg-white'}`}
        data-testid="plan-verdict"
      >
        {data.late ? <AlertTriangle aria-hidden className="mt-0.5 h-4 w-4" /> : <CalendarCheck aria-hidden className="mt-0.5 h-4 w-4" />}
        <p>
          {data.hoursLeft.toFixed(1)} hours left (the gags, and the matter pages not yet marked done) at {data.hoursPerWeek} h a week: finished about{' '}
          <strong>{data.finish}</strong>,{' '}
          {data.late ? (
            <strong>
              {counted(-data.marginDays, 'day')} after the deadline ({data.deadline}). The plan is late: add hours, cut pages or move the date.
            </strong>
          ) : (
            <>
              {counted(data.marginDays, 'day')} before the deadline ({data.deadline}).
            </>
          )}
        </p>
      </div>
      <div className="grid gap-4 md:grid-cols-[1fr_2fr]">
        <table className="text-sm">
          <thead>
            <tr className="text-left text-xs text-graphite-faint">
              <th className="py-1 font-normal">Stage</th>
              <th className="py-1 font-normal">h per page</th>
              <th className="py-1 font-normal">h left</th>
            </tr>
          </thead>
          <tbody>
            {STAGES.map((s) => (
              <tr key={s} className="border-t border-paper-edge/60">
                <th scope="row" className="py-1 text-left font-bold">
                  {STAGE_LABELS[s]}
                </th>
                <td>
                  {canEdit ? (
                    <input
                      type="number"
                      min={0}
                      step={0.25}
                      className="field w-20 py-0.5"
                      aria-label={`Hours per page for ${STAGE_LABELS[s]}`}
                      defaultValue={data.hoursPerPage[s]}
                      onBlur={(e) => void onPatch({ hoursPerPage: { [s]: Number(e.target.value) } })}
                    />
                  ) : (
                    data.hoursPerPage[s]
                  )}
                </td>
                <td>{data.hoursByStage[s].toFixed(2)}</td>
              </tr>
            ))}
            <tr className="border-t border-paper-edge/60">
              <th scope="row" className="py-1 text-left font-bold">
                Hours per week
              </th>
              <td colSpan={2}>
                {canEdit ? (
                  <input
                    type="number"
                    min={0.5}
                    step={0.5}
                    className="field w-20 py-0.5"
                    aria-label="Hours per week"
                    defaultValue={data.hoursPerWeek}
                    onBlur={(e) => void onPatch({ hoursPerWeek: Number(e.target.value) })}
                  />
                ) : (
                  data.hoursPerWeek
                )}
              </td>
            </tr>
          </tbody>
        </table>
        <div className="h-56" aria-label="Pages left, week by week" role="img">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={data.burndown} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
              <CartesianGrid stroke="#ded3bd" strokeDasharray="3 3" />
              <XAxis dataKey="date" tick={{ fontSize: 11 }} />
              <YAxis allowDecimals={false} tick={{ fontSize: 11 }} />
              <Tooltip />
              <ReferenceLine x={data.deadline} stroke="#b8321f" label={{ value: 'deadline', fontSize: 11, fill: '#b8321f' }} />
              <Line type="stepAfter" dataKey="pagesLeft" name="Pages left" stroke="#1d4e6e" strokeWidth={2} dot={false} isAnimationActive={false} />
            </LineChart>
          </ResponsiveContainer>
        </div>
      </div>
    </section>
  );
}
