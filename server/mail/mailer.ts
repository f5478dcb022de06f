import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';

export type OutgoingMail = { to: string; subject: string; text: string; html: string };

/** Sends mail through one SMTP transport (any relay in production, the local fake otherwise). */
export class Mailer {
  private readonly transport: Transporter;

  constructor(
    smtpUrl: string,
    private readonly from: string,
    private readonly logger: Logger,
  ) {
    this.transport = nodemailer.createTransport(smtpUrl);
  }

  /** Sends one message; failures are logged and rethrown for the caller to decide. */
  async send(mail: OutgoingMail): Promise<void> {
    try {
      await this.transport.sendMail({ from: this.from, ...mail });
      this.logger.info({ subject: mail.subject }, 'mail sent');
    } catch (error) {
      this.logger.error({ err: error, subject: mail.subject }, 'mail could not be sent');
      throw error;
    }
  }

  /** Closes pooled connections. */
  close(): void {
    this.transport.close();
  }
}
