'use client';
// An approved pass is a fixed point (issue 15). While the pass carries a standing "ready to ink"
// stamp the editor says so (who, when, at which revision), and the first change asks first:
// keep the approval and go on in a copy (a new pass), or change this pass and clear it.
// The question is the editor's alone, so it works offline: choosing "change this one" lets the
// change through the outbox like any other, and the server clears the stamp when it lands.
// Nothing drawn is held back or thrown away: the pen is stopped before a stroke begins.
import { useRouter } from 'next/navigation';
import { type RefObject, useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/modal';
import { When } from '@/components/ui/when';
import type { StampDto } from '@/db/queries/stamps';
import { useStamps } from '@/hooks/use-review';
import { api } from '@/lib/http/client';
import type { Tool } from './tools';

/** Tools whose press on the canvas changes the pass. The lasso only chooses; the pin comments. */
const CHANGING_TOOLS: ReadonlySet<Tool> = new Set(['pen', 'tone', 'eraser', 'room', 'lightbox']);

export type Approval = StampDto;

/** The stamp that approves this very pass, if it still stands. */
export function standingApproval(stamps: StampDto[] | undefined, passId: string): Approval | null {
  return stamps?.find((s) => s.passId === passId && s.decision === 'ready' && !s.clearedAt) ?? null;
}

export function useApproval(opts: {
  gagId: string;
  passId: string;
  passNumber: number;
  seriesId: string;
  canDraw: boolean;
  tool: Tool;
  wrapRef: RefObject<HTMLDivElement | null>;
}) {
  const { data: stamps } = useStamps(opts.gagId);
  const approval = standingApproval(stamps, opts.passId);
  // "Change this one" holds for the rest of this visit; a new stamp later asks again.
  const [changeAllowedFor, setChangeAllowedFor] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);
  const [copying, setCopying] = useState<string | null>(null);
  const held = useRef<(() => void) | null>(null);
  const locked = !!approval && opts.canDraw && changeAllowedFor !== approval.id;
  const lockedRef = useRef(locked);
  const toolRef = useRef(opts.tool);
  useEffect(() => {
    lockedRef.current = locked;
    toolRef.current = opts.tool;
  });
  const router = useRouter();

  // The pen, tone, eraser, room and lightbox tools: stopped at the press, before anything is drawn.
  useEffect(() => {
    const el = opts.wrapRef.current;
    if (!el) return;
    const press = (e: PointerEvent) => {
      if (!lockedRef.current || !CHANGING_TOOLS.has(toolRef.current)) return;
      e.stopImmediatePropagation();
      e.preventDefault();
      held.current = null;
      setAsking(true);
    };
    el.addEventListener('pointerdown', press, { capture: true });
    return () => el.removeEventListener('pointerdown', press, { capture: true });
  }, [opts.wrapRef]);

  /** Runs a change now, or asks first on an approved pass (the change runs if the answer is "change this one"). */
  const gateRef = useRef((change: () => void): void => {
    if (!lockedRef.current) return change();
    held.current = change;
    setAsking(true);
  });

  const changeThisOne = () => {
    if (approval) setChangeAllowedFor(approval.id);
    lockedRef.current = false;
    setAsking(false);
    const change = held.current;
    held.current = null;
    change?.();
  };

  const continueInCopy = async () => {
    setCopying('Making the copy…');
    try {
      const pass = await api<{ id: string; number: number }>(`/api/gags/${opts.gagId}/passes`, {
        method: 'POST',
        json: { copyFrom: opts.passNumber },
      });
      held.current = null;
      setAsking(false);
      setCopying(null);
      router.push(`/series/${opts.seriesId}/gags/${opts.gagId}/passes/${pass.number}`);
    } catch (err) {
      setCopying(
        `The copy could not be made (${err instanceof Error ? err.message : 'no answer'}). A copy needs the server; you can still change this pass.`,
      );
    }
  };

  const cancel = () => {
    held.current = null;
    setAsking(false);
    setCopying(null);
  };

  const dialog = approval ? (
    <Modal open={asking} onClose={cancel} labelledBy="approval-question">
      <h2 id="approval-question" className="text-xl font-extrabold">
        Pass {opts.passNumber} is approved
      </h2>
      <p className="text-graphite-soft">
        {approval.by} stamped it ready to ink on <When iso={approval.createdAt} /> at revision {approval.passSeq}. Any change to it clears that
        approval and puts the gag back in review.
      </p>
      {copying && (
        <p role="status" className="text-sm">
          {copying}
        </p>
      )}
      <div className="flex flex-wrap justify-end gap-2 pt-2">
        <Button variant="secondary" onClick={cancel}>
          Cancel
        </Button>
        <Button variant="secondary" onClick={changeThisOne}>
          Change this pass, clear the approval
        </Button>
        <Button onClick={() => void continueInCopy()} autoFocus disabled={copying === 'Making the copy…'}>
          Keep the approval, continue in a copy
        </Button>
      </div>
    </Modal>
  ) : null;

  return { approval, locked, gateRef, dialog };
}

/** The approval as the editor shows it, above the canvas. */
export function ApprovalNote({ approval, locked }: { approval: Approval | null; locked: boolean }) {
  if (!approval) return null;
  return (
    <p role="note" data-testid="approval-note" className="rounded border border-ink/30 bg-ink-light px-3 py-1 text-sm text-ink">
      <strong>Approved: ready to ink.</strong> {approval.by} stamped pass {approval.passNumber} on <When iso={approval.createdAt} />, at revision{' '}
      {approval.passSeq}. {locked ? 'Your first change will ask whether to keep this approval.' : 'Changing it clears the approval.'}
    </p>
  );
}
