import nodemailer, { type Transporter } from 'nodemailer';

// Outgoing mail through nodemailer over SMTP, to the one configured host only:
// a real server (SMTP_URL) or the local sink on loopback.
// Recipients are passed as { name, address } objects so nodemailer encodes
// display names itself; a name can never inject a header.

export interface OutgoingMail {
  to: { name: string; address: string };
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createMailer(smtpUrl: string, from: string): Mailer {
  const transport: Transporter = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      await transport.sendMail({ from, to: mail.to, subject: mail.subject.replace(/[\r\n]+/g, ' '), text: mail.text, html: mail.html });
    },
    close: () => transport.close(),
  };
}
