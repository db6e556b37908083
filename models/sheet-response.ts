import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize,
} from 'sequelize';

export type SheetResponseKind = 'acknowledged' | 'question';

/** The farmer's word on a sheet: an acknowledgement, or a question for the advisor and coordinator. */
export class SheetResponse extends Model<InferAttributes<SheetResponse>, InferCreationAttributes<SheetResponse>> {
  declare id: string;
  declare visitId: string;
  declare screeningId: string;
  declare farmerId: string;
  declare kind: SheetResponseKind;
  declare text: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetResponse.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        visitId: { type: DataTypes.UUID, allowNull: false },
        screeningId: { type: DataTypes.UUID, allowNull: false },
        farmerId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(12), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: 'SheetResponse', tableName: 'sheet_responses', underscored: true, updatedAt: false },
    );
  }
}
