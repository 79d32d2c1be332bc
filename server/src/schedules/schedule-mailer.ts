import { Injectable, Logger } from '@nestjs/common';
import { createTransport, type Transporter } from 'nodemailer';
import { loadMailConfig, type MailConfig } from './mail.config';

export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
}

/** Sends mail over SMTP (nodemailer); in development and tests that is the local fake. */
@Injectable()
export class ScheduleMailer {
  private readonly logger = new Logger(ScheduleMailer.name);
  private readonly config: MailConfig = loadMailConfig();
  private readonly transport: Transporter = createTransport({
    host: this.config.host,
    port: this.config.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });

  /** One message per recipient, so subscribers do not see each other. Answers the first error, or null. */
  async send(mail: OutgoingMail): Promise<{ sent: string[]; error: string | null }> {
    const sent: string[] = [];
    for (const to of mail.to) {
      try {
        await this.transport.sendMail({ from: this.config.from, to, subject: mail.subject, text: mail.text });
        sent.push(to);
      } catch (err) {
        const error = `could not send to ${to} via ${this.config.host}:${this.config.port}: ${(err as Error).message}`;
        this.logger.warn(error);
        return { sent, error };
      }
    }
    return { sent, error: null };
  }
}
