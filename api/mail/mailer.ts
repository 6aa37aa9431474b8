/**
 * Outgoing mail through nodemailer: SMTP_URL in production, the local catcher in demo and
 * test mode (no TLS on loopback).
 */
import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface MailMessage {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
  headers?: Record<string, string>;
}

export interface Mailer {
  send(msg: MailMessage): Promise<{ messageId: string }>;
  close(): void;
}

export function createMailer(config: Config): Mailer {
  const transport = config.smtpUrl
    ? nodemailer.createTransport(config.smtpUrl)
    : nodemailer.createTransport({
        host: '127.0.0.1',
        port: config.mailCatcherPort,
        secure: false,
        ignoreTLS: true,
        connectionTimeout: 5_000,
        greetingTimeout: 5_000,
      });
  return {
    async send(msg) {
      const info = await transport.sendMail({ from: config.mailFrom, ...msg });
      return { messageId: info.messageId };
    },
    close: () => transport.close(),
  };
}
