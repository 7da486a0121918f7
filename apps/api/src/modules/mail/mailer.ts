import nodemailer, { type Transporter } from 'nodemailer';

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Sends through SMTP: the real server from the environment, or the loopback capture server. */
export function createMailer(options: { smtpUrl?: string; capturePort?: number; from: string }): Mailer {
  let transport: Transporter;
  if (options.smtpUrl) {
    transport = nodemailer.createTransport(options.smtpUrl);
  } else if (options.capturePort) {
    transport = nodemailer.createTransport({
      host: '127.0.0.1',
      port: options.capturePort,
      secure: false,
      ignoreTLS: true,
    });
  } else {
    throw new Error('No SMTP server: set SPLITCASE_SMTP_URL or start the capture server.');
  }
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
    close() {
      transport.close();
    },
  };
}
