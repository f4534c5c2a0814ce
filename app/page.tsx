import Link from 'next/link';
import { SignInForm } from '@/components/auth/signin-form';
import { Wordmark } from '@/components/layout/wordmark';
import { currentUser } from '@/lib/auth/session';

export const dynamic = 'force-dynamic';

export default async function Landing() {
  const user = await currentUser();
  return (
    <main className="mx-auto grid min-h-screen max-w-5xl items-center gap-10 px-4 py-10 md:grid-cols-[1.2fr_1fr]">
      <section className="space-y-5">
        <Wordmark />
        <h1 className="text-4xl font-extrabold leading-tight md:text-5xl">Four beats. One square page. No words needed.</h1>
        <p className="max-w-prose text-lg text-graphite-soft">
          Quadrille is the shared thumbnail board for wordless four-panel gags: rough out the setup, build, turn and payoff, compare passes, talk them
          over, and let your editor stamp the one that is ready to ink.
        </p>
        <ol className="grid max-w-md grid-cols-2 gap-2 text-sm" aria-label="The four beats">
          {['Setup', 'Build', 'Turn', 'Payoff'].map((b, i) => (
            <li key={b} className="panel flex aspect-square flex-col justify-end p-3">
              <span className="font-display text-2xl font-extrabold text-marker-40">{i + 1}</span>
              <span className="font-bold">{b}</span>
            </li>
          ))}
        </ol>
      </section>
      {user ? (
        <section className="panel space-y-3 p-6">
          <h2 className="text-2xl font-extrabold">Welcome back, {user.name}</h2>
          <Link href="/series" className="inline-block rounded-md bg-ink px-4 py-2 font-bold text-white hover:bg-ink-hover">
            Go to my series
          </Link>
        </section>
      ) : (
        <SignInForm />
      )}
    </main>
  );
}
