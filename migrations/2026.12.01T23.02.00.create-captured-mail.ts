import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Mail captured by the local SMTP fake (scripts/mail-fake.ts), for development, the demo outbox
 * page and the tests. Production sends through a real SMTP server and leaves this table empty.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('captured_mail', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    message_id: { type: DataTypes.STRING(300), allowNull: true },
    envelope_from: { type: DataTypes.STRING(300), allowNull: true },
    // Envelope recipients, comma-separated, lower case.
    envelope_to: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.STRING(400), allowNull: true },
    text_body: { type: DataTypes.TEXT('long'), allowNull: true },
    html_body: { type: DataTypes.TEXT('long'), allowNull: true },
    raw: { type: DataTypes.TEXT('long'), allowNull: false },
    received_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('captured_mail', ['received_at'], { name: 'captured_mail_received' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('captured_mail');
};
