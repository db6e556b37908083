import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type SheetSendStatus = 'sending' | 'sent' | 'failed';

/** One e-mailing of a visit's sheet: who sent it, to whom, when, and whether the mail server took it. */
export class SheetSend extends Model<InferAttributes<SheetSend>, InferCreationAttributes<SheetSend>> {
  declare id: string;
  declare visitId: string;
  declare screeningId: string;
  declare sentById: string | null;
  declare toAddress: string;
  declare paper: string;
  declare status: SheetSendStatus;
  declare error: string | null;
  declare messageId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetSend.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        visitId: { type: DataTypes.UUID, allowNull: false },
        screeningId: { type: DataTypes.UUID, allowNull: false },
        sentById: { type: DataTypes.UUID, allowNull: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        paper: { type: DataTypes.STRING(8), allowNull: false },
        status: { type: DataTypes.STRING(8), allowNull: false },
        error: { type: DataTypes.STRING(500), allowNull: true },
        messageId: { type: DataTypes.STRING(255), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: 'SheetSend', tableName: 'sheet_sends', underscored: true },
    );
  }
}
