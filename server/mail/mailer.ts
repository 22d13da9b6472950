import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

const FROM = 'Shedwright <no-reply@shedwright.test>';

/** Sends through the SMTP server on 127.0.0.1:port (the local fake one). */
export function createMailer(port: number): Mailer {
  const transport = nodemailer.createTransport({
    host: '127.0.0.1',
    port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: FROM, ...mail });
    },
    close: () => transport.close(),
  };
}
