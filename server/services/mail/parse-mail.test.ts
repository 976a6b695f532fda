import { describe, expect, it } from 'vitest';
import { decodeEncodedWords, decodeQuotedPrintable, parseMail } from './parse-mail';

describe('parseMail', () => {
  it('decodes a base64 body and folded, encoded headers', () => {
    const raw = [
      'From: Tarnish <no-reply@tarnish.localhost>',
      'Subject: =?UTF-8?B?SW52aXRlZCB0byBWw6RsbGU=?=',
      ' =?UTF-8?Q?_Hydro?=',
      'Content-Transfer-Encoding: base64',
      '',
      Buffer.from('Open http://x.example/invitation?token=abc\r\nthen join.').toString('base64'),
      '',
    ].join('\r\n');
    const mail = parseMail(raw, ['a@b.example']);
    expect(mail.subject).toBe('Invited to Välle Hydro');
    expect(mail.text).toBe('Open http://x.example/invitation?token=abc\nthen join.');
    expect(mail.to).toEqual(['a@b.example']);
  });

  it('joins quoted-printable soft line breaks (RFC 2045, 6.7)', () => {
    expect(decodeQuotedPrintable('http://x.example/reset?token=3Dab=\r\ncd =C3=A9')).toBe('http://x.example/reset?token=abcd é');
  });

  it('leaves plain headers alone', () => {
    expect(decodeEncodedWords('Plain subject')).toBe('Plain subject');
  });
});
