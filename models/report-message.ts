import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/** Who wrote a message of a report's thread, in the test: the pattern's designer, a tester, an admin. */
export type ReportAuthorRole = 'designer' | 'tester' | 'admin'

/** One message of a report's thread. */
export class ReportMessage extends Model<InferAttributes<ReportMessage>, InferCreationAttributes<ReportMessage>> {
  declare id: CreationOptional<string>
  declare reportId: string
  /** Null once the author's account is deleted. */
  declare authorId: string | null
  declare authorRole: ReportAuthorRole
  declare text: string
  declare createdAt: CreationOptional<Date>
}

export function initReportMessage(sequelize: Sequelize): void {
  ReportMessage.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      reportId: { type: DataTypes.UUID, allowNull: false },
      authorId: { type: DataTypes.UUID, allowNull: true },
      authorRole: { type: DataTypes.TEXT, allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'report_messages', modelName: 'ReportMessage', updatedAt: false },
  )
}
