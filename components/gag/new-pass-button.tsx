'use client';
import { Plus } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { messageOf } from '@/lib/http/client';
import { startPass } from '@/hooks/use-passes';

/** Starts a pass, blank or as a copy of an earlier one, and opens it in the editor. */
export function NewPassButton({ seriesId, gagId, passNumbers }: { seriesId: string; gagId: string; passNumbers: number[] }) {
  const router = useRouter();
  const [from, setFrom] = useState<string>(passNumbers.length ? String(passNumbers[passNumbers.length - 1]) : '');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function start() {
    setBusy(true);
    setError(null);
    try {
      const pass = await startPass(gagId, from ? Number(from) : undefined);
      router.push(`/series/${seriesId}/gags/${gagId}/passes/${pass.number}`);
    } catch (err) {
      setError(messageOf(err, 'Could not start a pass.'));
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-wrap items-end gap-2">
      <label className="text-sm font-bold text-graphite-soft">
        Start from
        <select className="field mt-1 w-auto py-1.5" value={from} onChange={(e) => setFrom(e.target.value)}>
          <option value="">A blank page</option>
          {passNumbers.map((n) => (
            <option key={n} value={n}>
              A copy of pass {n}
            </option>
          ))}
        </select>
      </label>
      <Button onClick={() => void start()} disabled={busy}>
        <Plus aria-hidden className="h-4 w-4" /> New pass
      </Button>
      {error && (
        <p role="alert" className="text-sm text-stamp">
          {error}
        </p>
      )}
    </div>
  );
}
