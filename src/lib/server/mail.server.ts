// Server-only: sends e-mail over SMTP through nodemailer. In development and tests SMTP points
// at the local fake in fake-services/, which keeps every message for the inbox page.
import nodemailer, { type Transporter } from 'nodemailer';
import { config } from './config.server';

let transport: Transporter | undefined;

function transporter(): Transporter {
  if (!transport) {
    const { host, port, user, pass, secure } = config.smtp;
    transport = nodemailer.createTransport({
      host,
      port,
      secure,
      ignoreTLS: !secure && host === '127.0.0.1',
      auth: user ? { user, pass } : undefined,
    });
  }
  return transport;
}

export type OutgoingMail = { to: string; subject: string; text: string; html: string };

/** Sends one message; resolves with the SMTP message id. */
export async function sendMail(mail: OutgoingMail): Promise<string> {
  const info = await transporter().sendMail({ from: config.mailFrom, ...mail });
  return info.messageId;
}
