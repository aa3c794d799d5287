/**
 * Outgoing e-mail through nodemailer over SMTP. Real deployments set SMTP_* variables;
 * development and tests point it at the local sink. Without either, e-mail is off and
 * callers are told so (the portal still shows invitation links to the administrator).
 */
import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';

export interface SmtpSettings {
  host: string;
  port: number;
  secure: boolean;
  user?: string | undefined;
  pass?: string | undefined;
  from: string;
  /** The local sink speaks plain SMTP only. */
  ignoreTLS?: boolean;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  enabled: boolean;
  /** Sends; a failure is logged and reported as false, never thrown at the caller's request. */
  send(mail: OutgoingMail): Promise<boolean>;
  /** Sends and throws the SMTP failure, so the outbox can keep its reason. */
  deliver?(mail: OutgoingMail): Promise<void>;
}

export function createMailer(settings: SmtpSettings | null, logger: Logger): Mailer {
  if (!settings) {
    return {
      enabled: false,
      async send(mail) {
        logger.warn({ to: mail.to, subject: mail.subject }, 'e-mail is not configured (SMTP_HOST); message not sent');
        return false;
      },
    };
  }
  const transport: Transporter = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.secure,
    ignoreTLS: settings.ignoreTLS ?? false,
    auth: settings.user ? { user: settings.user, pass: settings.pass ?? '' } : undefined,
    connectionTimeout: 10_000,
    socketTimeout: 20_000,
  });
  const deliver = async (mail: OutgoingMail) => {
    await transport.sendMail({ from: settings.from, to: mail.to, subject: mail.subject, text: mail.text });
  };
  return {
    enabled: true,
    deliver,
    async send(mail) {
      try {
        await deliver(mail);
        return true;
      } catch (err) {
        logger.error({ err, to: mail.to, subject: mail.subject }, 'sending e-mail failed');
        return false;
      }
    },
  };
}
