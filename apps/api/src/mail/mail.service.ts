import { Injectable, Logger } from '@nestjs/common';
import { createTransport, type Transporter } from 'nodemailer';
import { AppConfig } from '../config/app-config';
import { MailCatcherService } from './mail-catcher.service';

export interface OutgoingMail {
  to: string;
  subject: string;
  /** Plain-text body (always sent). */
  text: string;
  /** HTML body (always sent beside the text). */
  html: string;
}

/**
 * The one way the product sends e-mail. Goes to SMTP_HOST when configured, otherwise to the local
 * mail catcher. (A persistent outbox with retries will sit behind this same method.)
 */
@Injectable()
export class MailService {
  private readonly logger = new Logger(MailService.name);
  private transporter: Transporter | null = null;

  constructor(
    private readonly config: AppConfig,
    private readonly catcher: MailCatcherService,
  ) {}

  async send(mail: OutgoingMail): Promise<void> {
    const info = await this.transport().sendMail({ from: this.config.mailFrom, ...mail });
    this.logger.log(`Sent "${mail.subject}" to ${mail.to} (${String(info.messageId)})`);
  }

  private transport(): Transporter {
    if (this.transporter) return this.transporter;
    const smtp = this.config.smtp;
    this.transporter = smtp
      ? createTransport({
          host: smtp.host,
          port: smtp.port,
          secure: smtp.secure,
          auth: smtp.user && smtp.pass ? { user: smtp.user, pass: smtp.pass } : undefined,
        })
      : createTransport({ host: '127.0.0.1', port: this.catcher.port, secure: false, ignoreTLS: true });
    return this.transporter;
  }
}
