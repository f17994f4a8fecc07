import { SMTPServer } from 'smtp-server';

export interface CaptureServer {
  port: number;
  /** The raw message received with this Message-ID, removed from memory once taken. */
  take(messageId: string): string | undefined;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 5_000_000;

/**
 * A local SMTP server for demo and development mode: accepts every message on loopback
 * (no authentication, no TLS) and keeps it until the sender records it in the outbox.
 * Nothing is relayed anywhere.
 */
export async function startCaptureServer(): Promise<CaptureServer> {
  const received = new Map<string, string>();
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const id = /^Message-ID:\s*(<[^>]+>)/im.exec(raw)?.[1];
        if (id) received.set(id, raw);
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    port,
    take(messageId) {
      const raw = received.get(messageId);
      received.delete(messageId);
      return raw;
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
