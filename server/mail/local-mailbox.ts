import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export type CapturedMail = {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string;
  date: string;
};

/**
 * The local mail fake for development and tests: an SMTP server on 127.0.0.1 that keeps
 * the last messages it receives in memory. Never started in production.
 */
export class LocalMailbox {
  private server: SMTPServer | null = null;
  private messages: CapturedMail[] = [];
  private nextId = 1;
  port = 0;

  constructor(private readonly keep = 500) {}

  /** Starts listening on a free loopback port; resolves with the port. */
  start(): Promise<number> {
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      size: 5 * 1024 * 1024,
      onData: (stream, session, callback) => {
        simpleParser(stream)
          .then((parsed) => {
            const to = session.envelope.rcptTo.map((r) => r.address);
            this.messages.unshift({
              id: this.nextId++,
              to,
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : '',
              date: (parsed.date ?? new Date()).toISOString(),
            });
            this.messages.length = Math.min(this.messages.length, this.keep);
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
    return new Promise((resolve, reject) => {
      this.server!.once('error', reject);
      this.server!.listen(0, '127.0.0.1', () => {
        const address = this.server!.server.address();
        this.port = typeof address === 'object' && address ? address.port : 0;
        resolve(this.port);
      });
    });
  }

  /** Messages received, newest first. */
  list(): CapturedMail[] {
    return [...this.messages];
  }

  /** Forgets every message. */
  clear(): void {
    this.messages = [];
  }

  /** Stops the SMTP server. */
  stop(): Promise<void> {
    return new Promise((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
