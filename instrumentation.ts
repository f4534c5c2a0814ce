// Runs once when the server starts: apply pending migrations before any request.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { getDb } = await import('./db/client');
    await getDb();
  }
}
