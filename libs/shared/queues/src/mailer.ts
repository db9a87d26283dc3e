import nodemailer, { type Transporter } from 'nodemailer';
import { requiredEnv } from '@latchwork/shared-server-kit';

/** The SMTP transport from SMTP_HOST / SMTP_PORT (STARTTLS only when SMTP_TLS=true). */
export function createMailerFromEnv(): Transporter {
  return nodemailer.createTransport({
    host: requiredEnv('SMTP_HOST'),
    port: Number(requiredEnv('SMTP_PORT')),
    secure: false,
    ignoreTLS: process.env['SMTP_TLS'] !== 'true',
  });
}
