import MailComposer from 'nodemailer/lib/mail-composer';
import { decodeEncodedWords, parseMessage } from './parse-message';

/** Builds a message with nodemailer's own composer, an implementation independent of the parser. */
function compose(options: ConstructorParameters<typeof MailComposer>[0]): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    new MailComposer(options).compile().build((err, message) => (err ? reject(err) : resolve(message))),
  );
}

describe('decodeEncodedWords', () => {
  // The examples of RFC 2047 §8.
  it.each([
    ['=?ISO-8859-1?Q?Keld_J=F8rn_Simonsen?=', 'Keld Jørn Simonsen'],
    ['=?ISO-8859-1?Q?Andr=E9?= Pirard', 'André Pirard'],
    ['(=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=)', '(ab)'],
    ['(=?ISO-8859-1?Q?a?=  \r\n    =?ISO-8859-1?Q?b?=)', '(ab)'],
    ['(=?ISO-8859-1?Q?a?= b)', '(a b)'],
    ['=?ISO-8859-1?B?SWYgeW91IGNhbiByZWFkIHRoaXMgeW8=?=', 'If you can read this yo'],
  ])('decodes %j as %j', (encoded, decoded) => {
    expect(decodeEncodedWords(encoded)).toBe(decoded);
  });

  it('leaves plain text alone', () => {
    expect(decodeEncodedWords('You are invited')).toBe('You are invited');
  });
});

describe('parseMessage on messages composed by nodemailer', () => {
  it('reads a quoted-printable body with non-ASCII text and long lines', async () => {
    const text = `Key: iso_live_Ab3x…9fQe — Sweep rig, Stage 3\n${'a long line '.repeat(20)}\n= sign kept`;
    const raw = await compose({
      from: 'a@test.example',
      to: 'b@test.example',
      subject: 'Plain subject',
      text,
      textEncoding: 'quoted-printable',
    });
    expect(raw.toString('latin1')).toMatch(/Content-Transfer-Encoding: quoted-printable/);
    expect(parseMessage(raw)).toEqual({ subject: 'Plain subject', text });
  });

  it('reads a base64 body and an encoded-word subject', async () => {
    const subject = 'Schlüssel für „Stage 3“ — neu';
    const text = 'Grüße\nzweite Zeile';
    const raw = await compose({
      from: 'a@test.example',
      to: 'b@test.example',
      subject,
      text,
      textEncoding: 'base64',
    });
    expect(raw.toString('latin1')).toMatch(/Subject: =\?UTF-8\?/);
    expect(parseMessage(raw)).toEqual({ subject, text });
  });

  it('takes the plain-text part of a multipart message', async () => {
    const raw = await compose({
      from: 'a@test.example',
      to: 'b@test.example',
      subject: 'Both',
      text: 'the text part',
      html: '<p>the html part</p>',
      attachments: [{ filename: 'note.txt', content: 'attached' }],
    });
    expect(raw.toString('latin1')).toMatch(/multipart\/mixed/);
    expect(parseMessage(raw)).toEqual({ subject: 'Both', text: 'the text part' });
  });

  it('survives a message without headers or body', () => {
    expect(parseMessage(Buffer.from(''))).toEqual({ subject: '', text: '' });
    expect(parseMessage(Buffer.from('Subject: only headers\r\n'))).toEqual({
      subject: 'only headers',
      text: '',
    });
  });
});
