import nodemailer, { type Transporter } from 'nodemailer';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra headers, e.g. List-Unsubscribe. */
  headers?: Record<string, string>;
}

/** Sends e-mail over SMTP: to the local mail catcher by default, any host by environment. */
export class Mailer {
  private readonly transport: Transporter;

  constructor(options: { host: string; port: number; user?: string; password?: string; from: string; local: boolean }) {
    this.transport = nodemailer.createTransport({
      host: options.host,
      port: options.port,
      secure: false,
      // The local catcher offers no TLS; hosted SMTP uses STARTTLS as usual.
      ignoreTLS: options.local,
      auth: options.user ? { user: options.user, pass: options.password } : undefined,
    });
    this.from = options.from;
  }
  private readonly from: string;

  async send(message: MailMessage): Promise<void> {
    await this.transport.sendMail({ from: this.from, ...message });
  }

  close(): void {
    this.transport.close();
  }
}
