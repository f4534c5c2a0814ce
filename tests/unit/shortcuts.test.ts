// The editor's keyboard map as data: a key press → an action.
import { describe, expect, it } from 'vitest';
import { SHORTCUTS, keyAction } from '@/components/editor/shortcuts';
import { PEN_SIZES, TOOL_ORDER, stepSize, toolAllowed } from '@/components/editor/tools';
import { copiesInPanel, roomFromNode } from '@/components/editor/use-selection';
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';

const free = { arranging: false };

describe('keyAction', () => {
  it('number keys pick the tools in toolbar order', () => {
    TOOL_ORDER.forEach((tool, i) => expect(keyAction({ key: String(i + 1) }, free)).toEqual({ do: 'tool', tool }));
    expect(keyAction({ key: '9' }, free)).toBeNull();
  });

  it('undo and redo with Ctrl or Cmd; other modified keys are left alone', () => {
    expect(keyAction({ key: 'z', ctrlKey: true }, free)).toEqual({ do: 'undo' });
    expect(keyAction({ key: 'Z', metaKey: true, shiftKey: true }, free)).toEqual({ do: 'redo' });
    expect(keyAction({ key: 'y', ctrlKey: true }, free)).toEqual({ do: 'redo' });
    expect(keyAction({ key: '1', ctrlKey: true }, free)).toBeNull();
  });

  it('J and K step the nib; the bracket keys do nothing', () => {
    expect(keyAction({ key: 'j' }, free)).toEqual({ do: 'width', dir: -1 });
    expect(keyAction({ key: 'K' }, free)).toEqual({ do: 'width', dir: 1 });
    expect(keyAction({ key: '[' }, free)).toBeNull();
    expect(keyAction({ key: ']' }, free)).toBeNull();
  });

  it('arrows pan the view, or nudge a chosen lightbox by 1 mm (Shift: 10 mm)', () => {
    expect(keyAction({ key: 'ArrowLeft' }, free)).toEqual({ do: 'pan', dx: 40, dy: 0 });
    expect(keyAction({ key: 'ArrowDown' }, { arranging: true })).toEqual({ do: 'nudge', dx: 0, dy: 1 });
    expect(keyAction({ key: 'ArrowRight', shiftKey: true }, { arranging: true })).toEqual({ do: 'nudge', dx: 10, dy: 0 });
  });

  it('every key the shortcut sheet names does something', () => {
    const sheetKeys = ['0', '+', '-', ',', '.', 'Delete', 'Escape', 'p', 'g', '?', 'j', 'k'];
    for (const key of sheetKeys) expect(keyAction({ key }, free), key).not.toBeNull();
    expect(SHORTCUTS.some(([keys]) => keys.includes('['))).toBe(false);
  });
});

describe('tool helpers', () => {
  it('steps sizes within range and leaves an unknown size alone', () => {
    expect(stepSize(PEN_SIZES, 0.5, 1)).toBe(0.8);
    expect(stepSize(PEN_SIZES, 2, 1)).toBe(2);
    expect(stepSize(PEN_SIZES, 0.3, -1)).toBe(0.3);
    expect(stepSize(PEN_SIZES, 0.7, 1)).toBe(0.7);
  });
  it('a viewer may only pan; a commenter may also pin', () => {
    expect(toolAllowed('pan', { draw: false, comment: false })).toBe(true);
    expect(toolAllowed('pin', { draw: false, comment: true })).toBe(true);
    expect(toolAllowed('pen', { draw: false, comment: true })).toBe(false);
  });
});

describe('selection helpers', () => {
  const panels = panelRects(DEFAULT_PAGE_SPEC);
  it('copies move by the offset between the panels, under new ids', () => {
    const s = { id: 'a', panel: 0, tool: 'pen' as const, grey: 100, size: 0.5, points: [[10, 12, 0.5]] as [number, number, number][] };
    const [c] = copiesInPanel([s], panels, 3, () => 'b');
    expect(c!.id).toBe('b');
    expect(c!.panel).toBe(3);
    expect(c!.points[0]).toEqual([
      Math.round((10 + panels[3]!.x - panels[0]!.x) * 100) / 100,
      Math.round((12 + panels[3]!.y - panels[0]!.y) * 100) / 100,
      0.5,
    ]);
  });
  it('a room resized past its panel is kept inside it, at least 2 mm', () => {
    const p = panels[1]!;
    const room = { id: 'r', panel: 1, shape: 'rect' as const, x: p.x + 5, y: p.y + 5, w: 10, h: 10 };
    const after = roomFromNode(room, { x: p.x + 5, y: p.y + 5, w: 10, h: 10, sx: 100, sy: 0.01 }, p);
    expect(after.x + after.w).toBeCloseTo(p.x + p.w, 2);
    expect(after.h).toBe(2);
  });
});
