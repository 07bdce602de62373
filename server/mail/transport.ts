// nodemailer over SMTP. Without SMTP_URL (development, tests) mail goes to the local fake.
import nodemailer, { type Transporter } from 'nodemailer';

export function createTransport(smtpUrl: string): Transporter {
  return nodemailer.createTransport(smtpUrl, {
    // A lab server should notice a dead SMTP server quickly and let the outbox retry later.
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  } as never);
}
