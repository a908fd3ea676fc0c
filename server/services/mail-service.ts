import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '@server/config';
import type { MailJob } from '@shared/queues';

let transport: Transporter | null = null;

export async function sendMail(mail: MailJob): Promise<void> {
  transport ??= nodemailer.createTransport(config.smtpUrl);
  await transport.sendMail({ from: config.mailFrom, to: mail.to, subject: mail.subject, text: mail.text });
}
