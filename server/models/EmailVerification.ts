import type { Sequelize } from 'sequelize';
import { MailedToken, mailedTokenColumns } from './MailedToken';

/** A mailed one-time token that proves the user reads their address (one open token per user). */
export class EmailVerification extends MailedToken {
  static initModel(sequelize: Sequelize): void {
    EmailVerification.init(mailedTokenColumns(), { sequelize, tableName: 'email_verifications' });
  }
}
