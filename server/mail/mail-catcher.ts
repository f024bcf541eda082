import fs from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

/** One message as the catcher kept it. */
export interface CaughtMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  date: string;
  /** The List-Unsubscribe header, when the message has one. */
  unsubscribe?: string;
}

/**
 * The local mail catcher used outside production: an SMTP server on loopback that parses each
 * message and keeps it in a JSON-lines file under the data folder, newest last, so that a
 * developer can read what the app sent.
 */
export class MailCatcher {
  private server?: SMTPServer;
  readonly file: string;

  constructor(dataDir: string) {
    this.file = path.join(dataDir, 'mail', 'messages.jsonl');
  }

  async start(port: number): Promise<number> {
    fs.mkdirSync(path.dirname(this.file), { recursive: true });
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData: (stream, _session, callback) => {
        simpleParser(stream)
          .then((mail) => {
            const to = Array.isArray(mail.to) ? mail.to.map((a) => a.text).join(', ') : (mail.to?.text ?? '');
            const record: CaughtMessage = {
              to,
              subject: mail.subject ?? '',
              text: mail.text ?? '',
              html: typeof mail.html === 'string' ? mail.html : '',
              date: (mail.date ?? new Date()).toISOString(),
            };
            // mailparser folds List-* headers into one "list" object.
            const list = mail.headers.get('list') as { unsubscribe?: { url?: string } } | undefined;
            if (list?.unsubscribe?.url) record.unsubscribe = list.unsubscribe.url;
            fs.appendFileSync(this.file, `${JSON.stringify(record)}\n`);
            callback();
          })
          .catch((err: Error) => callback(err));
      },
    });
    await new Promise<void>((resolve, reject) => {
      this.server!.once('error', reject);
      this.server!.listen(port, '127.0.0.1', () => resolve());
    });
    const address = this.server.server.address();
    return typeof address === 'object' && address ? address.port : port;
  }

  /** Messages kept so far, newest first. */
  messages(): CaughtMessage[] {
    if (!fs.existsSync(this.file)) return [];
    return fs
      .readFileSync(this.file, 'utf8')
      .split('\n')
      .filter(Boolean)
      .map((line) => JSON.parse(line) as CaughtMessage)
      .reverse();
  }

  async stop(): Promise<void> {
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
