// The SMTP fake on a free port with its own folder, for one test file.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from './free-port';
import { readCaughtMail, startFakeSmtp } from '@/lib/mail/fake-server';

export async function startMailFake() {
  const port = await freePort();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-mail-'));
  process.env.MAIL_FAKE_PORT = String(port);
  process.env.MAIL_FAKE_DIR = dir;
  delete process.env.SMTP_URL;
  const server = await startFakeSmtp(port, dir);
  return {
    read: () => readCaughtMail(dir),
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
