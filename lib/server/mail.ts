/** Outgoing e-mail through nodemailer to any SMTP relay (the fake one on a laptop). */
import "server-only";
import nodemailer from "nodemailer";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  check(): Promise<void>;
}

export function createSmtpMailer(settings: { url: string; from: string }): Mailer {
  const transport = nodemailer.createTransport(settings.url, { from: settings.from });
  return {
    async send(mail) {
      await transport.sendMail({ from: settings.from, ...mail });
    },
    async check() {
      await transport.verify();
    },
  };
}
