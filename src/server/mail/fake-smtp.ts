import { randomBytes } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

/**
 * The local stand-in for a mail provider: a real SMTP server on loopback that keeps every message
 * it receives as an .eml file in the outbox folder (written to a temp name, then renamed, so the
 * outbox never shows half a message). Nothing is relayed anywhere.
 */
export function startFakeSmtp(outboxDir: string, port = 0): Promise<{ port: number; close: () => Promise<void> }> {
  mkdirSync(outboxDir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    banner: 'Throwline local outbox',
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) return callback(new Error('Message too large'));
        const name = `${Date.now()}-${randomBytes(6).toString('hex')}.eml`;
        const tmp = join(outboxDir, `.${name}.tmp`);
        writeFileSync(tmp, Buffer.concat(chunks));
        renameSync(tmp, join(outboxDir, name));
        callback();
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const address = server.server.address() as { port: number };
      resolve({ port: address.port, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
