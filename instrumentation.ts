// Runs once when the server starts: apply pending migrations before any request, and on SQLite
// checkpoint from a thread of its own (db/checkpointer.ts);
// without SMTP_URL, start the local SMTP fake that /dev/mail reads; without
// S3_ENDPOINT, start the local S3 fake that stores uploads under data/s3.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { checkpointInBackground, getDb } = await import('./db/client');
  await getDb();
  await checkpointInBackground();
  if (!process.env.SMTP_URL && process.env.MAIL_FAKE !== 'off') {
    const { startFakeSmtp } = await import('./lib/mail/fake-server');
    const port = Number(process.env.MAIL_FAKE_PORT || 2525);
    try {
      await Promise.race([startFakeSmtp(port), new Promise((_, reject) => setTimeout(() => reject(new Error('timed out')), 5000))]);
      console.log(`[mail] local SMTP fake on 127.0.0.1:${port}; caught mail at /dev/mail`);
    } catch (err) {
      const code = (err as { code?: string }).code;
      console.log(
        code === 'EADDRINUSE' ? `[mail] port ${port} busy: using the SMTP fake already there` : `[mail] SMTP fake not started: ${String(err)}`,
      );
    }
  }
  if (!process.env.S3_ENDPOINT && process.env.S3_FAKE !== 'off') {
    const { startFakeS3 } = await import('./lib/storage/fake-s3');
    const port = Number(process.env.S3_FAKE_PORT || 4569);
    try {
      // Never let a fake hold up the server: give it a few seconds at most.
      await Promise.race([startFakeS3(port), new Promise((_, reject) => setTimeout(() => reject(new Error('timed out')), 5000))]);
      console.log(`[storage] local S3 fake on 127.0.0.1:${port}`);
    } catch (err) {
      const code = (err as { code?: string }).code;
      console.log(
        code === 'EADDRINUSE' ? `[storage] port ${port} busy: using the S3 fake already there` : `[storage] S3 fake not started: ${String(err)}`,
      );
    }
  }
  // Start one worker thread now, so the first big thumbnail or PDF does not wait for it to load.
  const { warmHeavyPool } = await import('./lib/workers/pool');
  warmHeavyPool();
}
