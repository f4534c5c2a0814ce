'use client';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/modal';

// Quadrille's own shortcut map: tools on the number keys in toolbar order.
export const SHORTCUTS: [string, string][] = [
  ['1 … 8', 'Pen, tone marker, eraser, lasso, balloon room, pan the view, comment pin, arrange the lightbox'],
  ['[  ]', 'Thinner / wider pen or marker'],
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

export function HelpSheet({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Modal open={open} onClose={onClose} labelledBy="help-title" width="34rem">
      <h2 id="help-title" className="text-xl font-extrabold">
        Keyboard shortcuts
      </h2>
      <table className="w-full text-sm">
        <tbody>
          {SHORTCUTS.map(([keys, what]) => (
            <tr key={keys} className="border-b border-paper-edge/60 last:border-0">
              <th scope="row" className="whitespace-nowrap py-1 pr-4 text-left font-mono text-xs">
                {keys}
              </th>
              <td className="py-1">{what}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex justify-end">
        <Button onClick={onClose}>Close</Button>
      </div>
    </Modal>
  );
}
