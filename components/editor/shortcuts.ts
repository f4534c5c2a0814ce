// Quadrille's own keyboard map, as data and a pure function from a key press
// to an action (the editor applies it; tests/unit/shortcuts.test.ts checks it).
// Tools sit on the number keys in toolbar order; nib width on J and K.
import { TOOL_ORDER, type Tool } from './tools';

export type KeyAction =
  | { do: 'undo' }
  | { do: 'redo' }
  | { do: 'tool'; tool: Tool }
  | { do: 'zoom'; factor: number }
  | { do: 'fit' }
  /** Pan the view by screen pixels. */
  | { do: 'pan'; dx: number; dy: number }
  /** Move the chosen lightbox by mm. */
  | { do: 'nudge'; dx: number; dy: number }
  | { do: 'width'; dir: -1 | 1 }
  | { do: 'grey'; dir: -1 | 1 }
  | { do: 'delete' }
  | { do: 'escape' }
  | { do: 'pen-only' }
  | { do: 'guides' }
  | { do: 'help' };

export const SHORTCUTS: [string, string][] = [
  ['1 … 8', 'Pen, tone marker, eraser, lasso, balloon room, pan the view, comment pin, arrange the lightbox'],
  ['J  K', 'Thinner / wider pen or marker'],
  [',  .', 'Lighter / darker tone grey'],
  ['+  −', 'Zoom in / out'],
  ['0', 'Fit the page'],
  ['Arrow keys', 'Pan; while arranging a chosen lightbox, nudge it 1 mm (Shift: 10 mm)'],
  ['Wheel', 'Zoom at the pointer (Shift + wheel pans)'],
  ['Two fingers', 'Pinch to zoom, drag to pan'],
  ['Ctrl+Z  /  Ctrl+Shift+Z', 'Undo / redo your own changes'],
  ['Delete', 'Delete the selection or the chosen balloon room; take away the chosen lightbox'],
  ['Esc', 'Clear the selection'],
  ['P', 'Pen only: ignore touch, so a resting palm draws nothing'],
  ['G', 'Show or hide all guides'],
  ['?', 'This sheet'],
];

const PAN_PX = 40;
const ARROWS: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };

type Key = { key: string; ctrlKey?: boolean; metaKey?: boolean; shiftKey?: boolean };

/** The action for a key press, or null. `arranging`: a lightbox is chosen with the arrange tool. */
export function keyAction(e: Key, ctx: { arranging: boolean }): KeyAction | null {
  const mod = e.ctrlKey || e.metaKey;
  const k = e.key.toLowerCase();
  if (mod && k === 'z') return { do: e.shiftKey ? 'redo' : 'undo' };
  if (mod && k === 'y') return { do: 'redo' };
  if (mod) return null;
  const n = Number(e.key);
  if (e.key.length === 1 && n >= 1 && n <= TOOL_ORDER.length) return { do: 'tool', tool: TOOL_ORDER[n - 1]! };
  const arrow = ARROWS[e.key];
  if (arrow) {
    if (ctx.arranging) {
      const step = e.shiftKey ? 10 : 1;
      return { do: 'nudge', dx: arrow[0] * step, dy: arrow[1] * step };
    }
    // The view moves the other way: the page slides under a fixed window.
    return { do: 'pan', dx: -arrow[0] * PAN_PX || 0, dy: -arrow[1] * PAN_PX || 0 };
  }
  switch (e.key) {
    case '+':
    case '=':
      return { do: 'zoom', factor: 1.25 };
    case '-':
    case '_':
      return { do: 'zoom', factor: 0.8 };
    case '0':
      return { do: 'fit' };
    case 'j':
    case 'J':
      return { do: 'width', dir: -1 };
    case 'k':
    case 'K':
      return { do: 'width', dir: 1 };
    case ',':
      return { do: 'grey', dir: -1 };
    case '.':
      return { do: 'grey', dir: 1 };
    case 'Delete':
    case 'Backspace':
      return { do: 'delete' };
    case 'Escape':
      return { do: 'escape' };
    case 'p':
    case 'P':
      return { do: 'pen-only' };
    case 'g':
    case 'G':
      return { do: 'guides' };
    case '?':
      return { do: 'help' };
    default:
      return null;
  }
}

/** Typing in a field is not a shortcut. */
export function isTypingTarget(t: EventTarget | null): boolean {
  const el = t as HTMLElement | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
}
