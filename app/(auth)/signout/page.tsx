import type { Metadata } from 'next';
import { SignOutPanel } from '@/components/auth/signout-panel';

export const metadata: Metadata = { title: 'Sign out' };

export default function SignOutPage() {
  return <SignOutPanel />;
}
