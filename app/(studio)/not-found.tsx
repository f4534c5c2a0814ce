import Link from 'next/link';

export default function NotFound() {
  return (
    <div className="panel mx-auto max-w-lg p-8 text-center">
      <h1 className="text-2xl font-extrabold">Nothing here</h1>
      <p className="mt-2 text-graphite-soft">This page does not exist, or it belongs to a series you are not a member of.</p>
      <Link href="/series" className="mt-4 inline-block font-bold text-ink underline">
        Back to my series
      </Link>
    </div>
  );
}
