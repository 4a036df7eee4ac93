import { createServer } from 'node:net';
import nodemailer from 'nodemailer';
import { generateKeySecret } from '../auth/key-secret';
import { createLogger } from '../logger';
import { createMailer, type Mailer } from './mailer';
import { notifyKeyCreated } from './notify-key-created';
import { OUTBOX_MAX_BYTES } from './outbox';

const logger = createLogger('silent');
const base = { mailFrom: 'Isochron <isochron@test.example>' };

describe('development mail server and outbox', () => {
  let mail: Mailer;
  beforeAll(async () => {
    mail = await createMailer({ ...base, env: 'test', smtpUrl: null }, logger);
  });
  afterAll(() => mail.close());

  it('delivers over SMTP on the loopback interface into the outbox', async () => {
    expect(mail.description).toMatch(/^local development mail server on 127\.0\.0\.1:\d+/);
    const sent = await mail.send({
      to: 'mix@test.example',
      subject: 'Level check — Stage 3',
      text: 'Pink noise at −20 dBFS.\nStart quietly.',
    });
    expect(sent).toBe(true);
    expect(mail.outbox!.list(1).data[0]).toMatchObject({
      to: 'mix@test.example',
      subject: 'Level check — Stage 3',
      text: 'Pink noise at −20 dBFS.\nStart quietly.',
    });
  });

  it('cannot be made to add headers through a subject with line breaks', async () => {
    await mail.send({ to: 'mix@test.example', subject: 'Hello\r\nBcc: someone@evil.example', text: 'x' });
    const received = mail.outbox!.list(1).data[0];
    expect(received.to).toBe('mix@test.example');
    expect(received.subject).toBe('Hello Bcc: someone@evil.example');
  });

  it('tells a key owner about a new key without ever including the key', async () => {
    const { secret, prefix, lastFour } = generateKeySecret('live');
    const sent = await notifyKeyCreated(
      { mail },
      {
        ownerEmail: 'dev@test.example',
        keyName: 'Sweep rig — Stage 3',
        role: 'tuning',
        prefix,
        lastFour,
        createdBy: 'admin@test.example',
      },
    );
    expect(sent).toBe(true);
    const notice = mail.outbox!.list(1).data[0];
    expect(notice.to).toBe('dev@test.example');
    expect(notice.subject).toBe('An Isochron API key was created for you');
    expect(notice.text).toContain('Sweep rig — Stage 3');
    expect(notice.text).toContain(`${prefix}…${lastFour}`);
    expect(notice.text).toContain('admin@test.example created an API key');
    expect(notice.text).not.toContain(secret);
    expect(notice.text).not.toContain(secret.slice(prefix.length, -4));
  });
});

describe('the development mail server under a flood from another local process', () => {
  it('keeps the outbox within its message and byte limits and refuses oversized messages', async () => {
    const mail = await createMailer({ ...base, env: 'development', smtpUrl: null }, logger);
    try {
      const port = Number(/127\.0\.0\.1:(\d+)/.exec(mail.description)![1]);
      const intruder = nodemailer.createTransport({
        host: '127.0.0.1',
        port,
        secure: false,
        ignoreTLS: true,
      });
      const text = 'x'.repeat(30 * 1024);
      for (let i = 0; i < 60; i++) {
        await intruder.sendMail({
          from: 'x@test.example',
          to: 'y@test.example',
          subject: `flood ${i}`,
          text,
        });
      }
      expect(mail.outbox!.sizeBytes).toBeLessThanOrEqual(OUTBOX_MAX_BYTES);
      expect(mail.outbox!.size).toBeLessThan(60);
      expect(mail.outbox!.list(1).data[0].subject).toBe('flood 59');
      await expect(
        intruder.sendMail({
          from: 'x@test.example',
          to: 'y@test.example',
          subject: 'huge',
          text: 'y'.repeat(100 * 1024),
        }),
      ).rejects.toThrow();
      expect(mail.outbox!.list(1).data[0].subject).toBe('flood 59');
      intruder.close();
    } finally {
      await mail.close();
    }
  });
});

describe('mail without the development server', () => {
  it('has no outbox and refuses to send in production without SMTP_URL', async () => {
    const mail = await createMailer({ ...base, env: 'production', smtpUrl: null }, logger);
    expect(mail.outbox).toBeNull();
    expect(await mail.send({ to: 'a@test.example', subject: 's', text: 't' })).toBe(false);
    await mail.close();
  });

  it('answers false instead of throwing when the mail server refuses the connection', async () => {
    const server = createServer();
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as { port: number };
    await new Promise((resolve) => server.close(resolve));
    const mail = await createMailer(
      { ...base, env: 'production', smtpUrl: `smtp://127.0.0.1:${port}` },
      logger,
    );
    expect(mail.outbox).toBeNull();
    await expect(mail.send({ to: 'a@test.example', subject: 's', text: 't' })).resolves.toBe(false);
    await mail.close();
  });
});
