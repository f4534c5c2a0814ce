// The key that signs and encrypts session tokens. Production must set
// NEXTAUTH_SECRET; development and tests fall back to a fixed local value.
export function authSecret(): string | undefined {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  if (process.env.NODE_ENV !== 'production') return 'quadrille-local-development-secret';
  return undefined;
}
