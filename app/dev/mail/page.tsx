// The local mailbox: what the SMTP fake caught. Only outside production
// (or when QUADRILLE_DEV_PAGES=1, as the browser tests set).
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { readCaughtMail } from '@/lib/mail/fake-server';

export const metadata: Metadata = { title: 'Local mailbox' };
export const dynamic = 'force-dynamic';

export default async function DevMail() {
  if (process.env.NODE_ENV === 'production' && process.env.QUADRILLE_DEV_PAGES !== '1') notFound();
  if (process.env.SMTP_URL) {
    return <main className="mx-auto max-w-3xl p-6">Mail goes to SMTP_URL; nothing is caught here.</main>;
  }
  const mail = await readCaughtMail();
  return (
    <main className="mx-auto max-w-4xl space-y-4 p-6">
      <h1 className="text-3xl font-extrabold">Local mailbox</h1>
      <p className="text-graphite-soft">Everything Quadrille sent while no SMTP_URL is set, newest first. Development only.</p>
      {mail.length === 0 && <p>No mail yet.</p>}
      <ol className="space-y-3">
        {mail.map((m) => (
          <li key={m.file} className="panel p-4" data-testid="caught-mail">
            <p className="font-bold">{m.subject}</p>
            <p className="text-sm text-graphite-soft">
              To {m.to} · from {m.from} · {m.date}
            </p>
            <pre className="mt-2 whitespace-pre-wrap font-sans text-sm">{m.text}</pre>
          </li>
        ))}
      </ol>
    </main>
  );
}
