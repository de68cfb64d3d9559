import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

import type { MailKind, OutboxStatus } from '@/lib/views/mail';

export type { MailKind, OutboxStatus };

/**
 * One e-mail in the durable outbox. A row is written first; the delivery job claims it (status
 * 'sending' with a claim that expires), sends it and marks it sent, or schedules the next try.
 * `dedupeKey` is unique: enqueueing the same message twice writes one row. `messageId` is fixed at
 * enqueue, so a message re-sent after a crash mid-delivery carries the same Message-ID.
 */
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  declare organizationId: number | null;
  declare userId: number | null;
  declare alertId: CreationOptional<number | null>;
  declare kind: MailKind;
  declare toAddress: string;
  declare subject: string;
  declare text: string;
  declare html: string;
  /** Extra headers (List-Unsubscribe and the like). */
  declare headers: CreationOptional<Record<string, string> | null>;
  declare dedupeKey: string;
  declare messageId: string;
  declare status: CreationOptional<OutboxStatus>;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: Date;
  /** After this the message is pointless (a reminder after its switch-on time) and is not sent. */
  declare expiresAt: CreationOptional<Date | null>;
  declare claimedBy: CreationOptional<string | null>;
  declare claimedUntil: CreationOptional<Date | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOutboxMessage(sequelize: Sequelize) {
  OutboxMessage.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: true },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      alertId: { type: DataTypes.INTEGER, allowNull: true },
      kind: { type: DataTypes.STRING(24), allowNull: false },
      toAddress: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(250), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: false },
      headers: { type: DataTypes.JSON, allowNull: true },
      dedupeKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      messageId: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.STRING(500), allowNull: true },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: true },
      claimedBy: { type: DataTypes.STRING(120), allowNull: true },
      claimedUntil: { type: DataTypes.DATE, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'outbox_messages' },
  );
}
