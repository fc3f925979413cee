import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/**
 * Sends e-mail through the SMTP server named by CONSERVA_SMTP_URL (in development and tests the local
 * mailbox). Without a server it sends nothing and logs what it would have sent.
 */
export class SweepMailer {
  private readonly transport: Transporter | null;

  constructor(
    smtpUrl: string | null,
    private readonly from: string,
    private readonly logger: Logger,
  ) {
    this.transport = smtpUrl ? nodemailer.createTransport(smtpUrl) : null;
  }

  /** True when the server accepted the message. Throws on delivery failure, so the job can retry. */
  async send(mail: OutgoingMail): Promise<boolean> {
    if (!this.transport) {
      this.logger.warn({ to: mail.to, subject: mail.subject }, 'no SMTP server configured (CONSERVA_SMTP_URL): e-mail not sent');
      return false;
    }
    await this.transport.sendMail({ from: this.from, to: mail.to, subject: mail.subject, text: mail.text });
    return true;
  }

  close(): void {
    this.transport?.close();
  }
}
