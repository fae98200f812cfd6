import { join } from 'node:path';
import nodemailer, { type Transporter } from 'nodemailer';
import { getConfig } from '~/server/config';
import { startFakeSmtp } from './fake-smtp';

export const FROM_ADDRESS = 'Throwline <no-reply@throwline.invalid>';

export function outboxDir(): string {
  return join(getConfig().DATA_DIR, 'outbox');
}

let transport: Promise<Transporter> | undefined;

/**
 * SMTP_URL when it is set; otherwise the local fake SMTP server, started on first use and kept
 * for the life of the process, so mail sent on a demo or test instance lands in the outbox.
 */
export function getMailer(): Promise<Transporter> {
  transport ??= (async () => {
    const config = getConfig();
    if (config.SMTP_URL) return nodemailer.createTransport(config.SMTP_URL);
    const fake = await startFakeSmtp(outboxDir(), config.FAKE_SMTP_PORT);
    return nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true });
  })();
  transport.catch(() => (transport = undefined));
  return transport;
}

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

export async function sendMail(message: MailMessage): Promise<void> {
  const mailer = await getMailer();
  await mailer.sendMail({ from: FROM_ADDRESS, ...message });
}
