import type { Sequelize } from 'sequelize';
import { MailedToken, mailedTokenColumns } from './MailedToken';

/** A mailed one-time token that lets the user set a new password (one open token per user). */
export class PasswordReset extends MailedToken {
  static initModel(sequelize: Sequelize): void {
    PasswordReset.init(mailedTokenColumns(), { sequelize, tableName: 'password_resets' });
  }
}
