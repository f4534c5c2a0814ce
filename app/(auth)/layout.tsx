import { Wordmark } from '@/components/layout/wordmark';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-4 py-10">
      <Wordmark />
      {children}
    </main>
  );
}
