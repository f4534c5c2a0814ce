'use client';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/modal';
import { SHORTCUTS } from './shortcuts';

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
