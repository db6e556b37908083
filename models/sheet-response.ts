import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** acknowledged: "I have read it"; go-ahead / not-now: the farmer's decision; question; answer (staff). */
export type SheetResponseKind = 'acknowledged' | 'go-ahead' | 'not-now' | 'question' | 'answer';

/** One line of a sheet's thread: the farmer's reading, decision or question, or staff's answer. */
export class SheetResponse extends Model<InferAttributes<SheetResponse>, InferCreationAttributes<SheetResponse>> {
  declare id: string;
  declare visitId: string;
  declare screeningId: string;
  declare authorId: string;
  declare replyToId: string | null;
  declare kind: SheetResponseKind;
  declare text: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetResponse.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        visitId: { type: DataTypes.UUID, allowNull: false },
        screeningId: { type: DataTypes.UUID, allowNull: false },
        authorId: { type: DataTypes.UUID, allowNull: false },
        replyToId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.STRING(12), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: 'SheetResponse', tableName: 'sheet_responses', underscored: true, updatedAt: false },
    );
  }
}
