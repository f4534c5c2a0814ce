import Link from 'next/link';

export default function NotFound() {
  return (
    <p>
      Nothing here.{' '}
      <Link href="/signin" className="font-bold text-ink underline">
        Sign in
      </Link>
    </p>
  );
}
