import type { Metadata } from 'next';
import { AccountPage } from '@/components/account/account-page';
import { requireUser } from '@/lib/data/studio';

export const metadata: Metadata = { title: 'My account' };
export const dynamic = 'force-dynamic';

export default async function Account() {
  const user = await requireUser('/account');
  return <AccountPage name={user.name} email={user.email} />;
}
