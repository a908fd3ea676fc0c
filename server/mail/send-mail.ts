import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '@server/config';

/** A mail ready to go: the recipient and both bodies, plain text and HTML. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

let transport: Transporter | null = null;

export async function sendMail(mail: OutgoingMail): Promise<void> {
  transport ??= nodemailer.createTransport(config.smtpUrl);
  await transport.sendMail({ from: config.mailFrom, ...mail });
}
