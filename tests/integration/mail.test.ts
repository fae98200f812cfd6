import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { freePort, startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn } from '../helpers/session';

describe('mail through the local stand-in (no SMTP_URL)', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startServer();
  });
  afterAll(() => server?.stop());

  it('an admin sends a test message; it lands in the outbox and on the outbox page', async () => {
    const admin = await signIn(server.url, DEMO.admin);
    const res = await admin.fetch('/api/admin/mail-test', { method: 'POST', headers: { accept: 'application/json' } });
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ sent: true, to: DEMO.admin });
    const files = readdirSync(join(server.dir, 'outbox')).filter((n) => n.endsWith('.eml'));
    expect(files).toHaveLength(1);
    const page = await (await admin.fetch('/admin/outbox')).text();
    expect(page).toContain('Throwline test message');
    expect(page).toContain(DEMO.admin);
  });

  it('only an admin may send or read the outbox', async () => {
    const manager = await signIn(server.url, DEMO.manager);
    expect((await manager.fetch('/api/admin/mail-test', { method: 'POST' })).status).toBe(403);
    expect((await manager.fetch('/admin/outbox')).status).toBe(403);
    expect((await anonymous(server.url).fetch('/api/admin/mail-test', { method: 'POST' })).status).toBe(401);
  });
});

describe('mail through SMTP_URL', () => {
  const received: { to: string[]; raw: string }[] = [];
  let smtp: SMTPServer;
  let server: TestServer;

  beforeAll(async () => {
    const port = await freePort();
    smtp = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, session, callback) {
        let raw = '';
        stream.on('data', (c) => (raw += c));
        stream.on('end', () => {
          received.push({ to: session.envelope.rcptTo.map((r) => r.address), raw });
          callback();
        });
      },
    });
    await new Promise<void>((r) => smtp.listen(port, '127.0.0.1', () => r()));
    server = await startServer({ SMTP_URL: `smtp://127.0.0.1:${port}` });
  });
  afterAll(async () => {
    await server?.stop();
    await new Promise<void>((r) => smtp.close(() => r()));
  });

  it('delivers to the configured server, not the outbox', async () => {
    const admin = await signIn(server.url, DEMO.admin);
    const res = await admin.fetch('/api/admin/mail-test', { method: 'POST', headers: { accept: 'application/json' } });
    expect(res.status).toBe(200);
    expect(received).toHaveLength(1);
    expect(received[0].to).toEqual([DEMO.admin]);
    expect(received[0].raw).toContain('Subject: Throwline test message');
  });
});
