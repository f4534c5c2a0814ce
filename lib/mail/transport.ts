// Sends mail with nodemailer: to SMTP_URL when set, otherwise over SMTP to the
// local fake (lib/mail/fake-server.ts) on 127.0.0.1. Every attempt is logged.
import 'server-only';
import type { Kysely } from 'kysely';
import nodemailer from 'nodemailer';
import type { Database } from '@/db/database';
import type { Mail } from './templates';
import { logMail } from '@/db/queries/mail';

export const FAKE_SMTP_PORT_DEFAULT = 2525;

export function fakeSmtpPort(): number {
  return Number(process.env.MAIL_FAKE_PORT || FAKE_SMTP_PORT_DEFAULT);
}

function transport() {
  if (process.env.SMTP_URL) return nodemailer.createTransport(process.env.SMTP_URL);
  // The fake speaks plain SMTP on loopback only.
  return nodemailer.createTransport({ host: '127.0.0.1', port: fakeSmtpPort(), secure: false, ignoreTLS: true });
}

export const MAIL_FROM = process.env.MAIL_FROM || 'Quadrille <studio@quadrille.test>';

/** Sends one message; a failure is logged and reported, never thrown into the request that caused it. */
export async function sendMail(
  db: Kysely<Database>,
  to: string,
  kind: string,
  mail: Mail,
): Promise<{ ok: boolean; messageId?: string; error?: string }> {
  const createdAt = new Date().toISOString();
  try {
    const info = await transport().sendMail({ from: MAIL_FROM, to, subject: mail.subject, text: mail.text, html: mail.html });
    await logMail(db, { to, subject: mail.subject, kind, messageId: info.messageId, error: null, createdAt });
    return { ok: true, messageId: info.messageId };
  } catch (err) {
    const error = err instanceof Error ? err.message : String(err);
    await logMail(db, { to, subject: mail.subject, kind, messageId: null, error, createdAt });
    console.error(`[mail] could not send ${kind} to ${to}: ${error}`);
    return { ok: false, error };
  }
}
