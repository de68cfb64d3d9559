import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A message the embedded local SMTP capture received, as read from its MIME source. The organization
 * is taken from the outbox row with the same Message-ID, else from the recipient's account; a message
 * matching neither is kept but shown to nobody.
 */
export class CapturedMail extends Model<InferAttributes<CapturedMail>, InferCreationAttributes<CapturedMail>> {
  declare id: CreationOptional<number>;
  declare organizationId: number | null;
  declare messageId: string | null;
  declare envelopeFrom: string;
  declare recipients: string[];
  declare fromHeader: string;
  declare toHeader: string;
  declare subject: string;
  declare text: string;
  declare html: string;
  declare headers: Record<string, string>;
  declare raw: string;
  declare sizeBytes: number;
  declare receivedAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCapturedMail(sequelize: Sequelize) {
  CapturedMail.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER, allowNull: true },
      messageId: { type: DataTypes.STRING(250), allowNull: true, unique: true },
      envelopeFrom: { type: DataTypes.STRING(254), allowNull: false },
      recipients: { type: DataTypes.JSON, allowNull: false },
      fromHeader: { type: DataTypes.STRING(500), allowNull: false },
      toHeader: { type: DataTypes.STRING(500), allowNull: false },
      subject: { type: DataTypes.STRING(500), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: false },
      headers: { type: DataTypes.JSON, allowNull: false },
      raw: { type: DataTypes.TEXT, allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'captured_mails' },
  );
}
