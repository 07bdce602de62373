// The local fake SMTP server for development and tests: a real SMTP conversation on loopback
// (smtp-server), every message parsed (mailparser) and kept in memory, newest first.
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface ReceivedMessage {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string | null;
  /** The Message-ID header, by which a receiving server can drop a second copy. */
  messageId: string | null;
  receivedAt: string;
}

export interface Mailbox {
  list(): ReceivedMessage[];
}

export interface FakeSmtp extends Mailbox {
  port: number;
  url: string;
  close(): Promise<void>;
}

export interface FakeSmtpOptions {
  port?: number;
  host?: string;
  /** Called with each message before the server answers 250 (the fault suite acts here). */
  onMessage?: (message: ReceivedMessage) => void;
}

export async function startFakeSmtp(options: FakeSmtpOptions = {}): Promise<FakeSmtp> {
  const messages: ReceivedMessage[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Voltcrib local fake SMTP',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const message: ReceivedMessage = {
            id: nextId++,
            to: session.envelope.rcptTo.map((r) => r.address),
            from: typeof session.envelope.mailFrom === 'object' && session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            messageId: parsed.messageId ?? null,
            receivedAt: new Date().toISOString(),
          };
          messages.unshift(message);
          options.onMessage?.(message);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  const host = options.host ?? '127.0.0.1';
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const address = (server as unknown as { server: { address(): { port: number } } }).server.address();
  return {
    port: address.port,
    url: `smtp://${host}:${address.port}`,
    list: () => [...messages],
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
