// The local stand-in for a mail server: smtp-server on 127.0.0.1, keeping every
// message it receives as an .eml file in MAIL_FAKE_DIR (default data/mail) for
// /dev/mail to show. Its built-in STARTTLS certificate has expired, so STARTTLS
// and AUTH are switched off; it only listens on loopback.
import fs from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

export function fakeMailDir(): string {
  return path.resolve(/*turbopackIgnore: true*/ process.env.MAIL_FAKE_DIR || 'data/mail');
}

export function startFakeSmtp(port: number, dir = fakeMailDir()): Promise<SMTPServer> {
  fs.mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    disabledCommands: ['AUTH', 'STARTTLS'],
    authOptional: true,
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const name = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}.eml`;
        fs.writeFile(path.join(dir, name), Buffer.concat(chunks), (err) => callback(err ?? null));
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(server));
  });
}

/** The caught messages, newest first, parsed. */
export async function readCaughtMail(dir = fakeMailDir()) {
  const { simpleParser } = await import('mailparser');
  if (!fs.existsSync(/*turbopackIgnore: true*/ dir)) return [];
  const files = fs
    .readdirSync(/*turbopackIgnore: true*/ dir)
    .filter((f) => f.endsWith('.eml'))
    .sort()
    .reverse()
    .slice(0, 200);
  const out = [];
  for (const f of files) {
    const parsed = await simpleParser(fs.readFileSync(/*turbopackIgnore: true*/ path.join(/*turbopackIgnore: true*/ dir, f)));
    const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
    out.push({
      file: f,
      subject: parsed.subject ?? '',
      to,
      from: parsed.from?.text ?? '',
      date: parsed.date?.toISOString() ?? '',
      text: parsed.text ?? '',
      html: typeof parsed.html === 'string' ? parsed.html : '',
    });
  }
  return out;
}
