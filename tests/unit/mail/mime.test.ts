import { describe, expect, it } from 'vitest';
// nodemailer's own composer builds the messages: the reader is checked against what the sender writes.
import MailComposer from 'nodemailer/lib/mail-composer';
import { decodeWords, readMime } from '@/lib/mail/mime';

function compose(opts: ConstructorParameters<typeof MailComposer>[0]): Promise<string> {
  return new Promise((resolve, reject) =>
    new MailComposer(opts).compile().build((err, buf) => (err ? reject(err) : resolve(buf.toString('latin1')))),
  );
}

describe('readMime', () => {
  it('reads subject, addresses, Message-ID and both parts of a multipart/alternative message', async () => {
    const text = 'Oil at departure −15 °C; ready needs 20 °C.\n' + 'A long line '.repeat(20);
    const html = '<p style="color:#255f7e">Oil at departure <b>−15 °C</b> — needs 20 °C</p>';
    const raw = await compose({
      from: 'Thawline <no-reply@thawline.test>',
      to: 'Tove Rask <pilot@frostvale.test>',
      subject: 'Oil-too-cold warning — Q-SIPI at 07:30 (−15 °C)',
      messageId: '<abc123@thawline.local>',
      text,
      html,
    });
    const m = readMime(raw);
    expect(m.subject).toBe('Oil-too-cold warning — Q-SIPI at 07:30 (−15 °C)');
    expect(m.to).toContain('pilot@frostvale.test');
    expect(m.from).toContain('no-reply@thawline.test');
    expect(m.messageId).toBe('<abc123@thawline.local>');
    expect(m.text.trim()).toBe(text.trim());
    expect(m.html).toBe(html);
  });

  it('reads base64 bodies and a plain single-part message', async () => {
    const b64 = await compose({ from: 'a@b.test', to: 'c@d.test', subject: 'Plain', text: 'Ääkköset ja pakkanen', textEncoding: 'base64' });
    expect(readMime(b64).text).toBe('Ääkköset ja pakkanen');
    const plain = 'From: a@b.test\r\nTo: c@d.test\r\nSubject: Hello\r\n\r\nJust text\r\n';
    const m = readMime(plain);
    expect(m.subject).toBe('Hello');
    expect(m.text).toBe('Just text\n');
    expect(m.html).toBe('');
    expect(m.messageId).toBeNull();
  });

  it('decodes encoded words of both kinds (RFC 2047 examples)', () => {
    // RFC 2047 section 8 examples (from memory): adjacent encoded words join without the blank between them.
    expect(decodeWords('=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=')).toBe('ab');
    expect(decodeWords('=?ISO-8859-1?Q?Andr=E9?= Pirard')).toBe('André Pirard');
    expect(decodeWords('=?UTF-8?B?8J+nig==?=')).toBe('🧊');
  });
});
