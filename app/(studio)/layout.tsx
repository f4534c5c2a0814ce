import { StudioHeader } from '@/components/layout/studio-header';
import { currentUser } from '@/lib/auth/session';

export default async function StudioLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUser();
  return (
    <>
      <StudioHeader user={user} />
      <main className="mx-auto max-w-7xl px-4 py-6">{children}</main>
    </>
  );
}
