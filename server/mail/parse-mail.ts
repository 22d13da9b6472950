import { simpleParser, type AddressObject } from 'mailparser';

/** The parts of a message the dev mailbox shows. */
export interface ParsedMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  date?: string;
}

function addresses(to: AddressObject | AddressObject[] | undefined): string {
  return (Array.isArray(to) ? to : to ? [to] : []).map((a) => a.text).join(', ');
}

/** Reads a captured message (headers, encoded words, multipart text and HTML) with mailparser. */
export async function parseMail(raw: Buffer | string): Promise<ParsedMail> {
  const mail = await simpleParser(raw);
  return {
    to: addresses(mail.to),
    subject: mail.subject ?? '',
    text: (mail.text ?? '').replace(/\r?\n$/, ''),
    ...(typeof mail.html === 'string' ? { html: mail.html.replace(/\r?\n$/, '') } : {}),
    ...(mail.date ? { date: mail.date.toISOString() } : {}),
  };
}
