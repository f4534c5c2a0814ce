import Link from 'next/link';

/** The Quadrille mark: a square page cut into four beats, the last one inked. */
export function Wordmark({ href = '/' }: { href?: string }) {
  return (
    <Link href={href} className="inline-flex items-center gap-2 rounded-md font-display text-xl font-extrabold text-graphite">
      <span aria-hidden className="grid grid-cols-2 gap-[3px] rounded-[3px] border-2 border-graphite bg-white p-[3px]">
        <span className="h-2 w-2 bg-marker-20" />
        <span className="h-2 w-2 bg-marker-40" />
        <span className="h-2 w-2 bg-marker-60" />
        <span className="h-2 w-2 bg-stamp" />
      </span>
      Quadrille
    </Link>
  );
}
