import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A photo of a report: the link that lets the pattern's designer and testers read the upload. */
export class ReportPhoto extends Model<InferAttributes<ReportPhoto>, InferCreationAttributes<ReportPhoto>> {
  declare reportId: string
  declare uploadId: string
  /** Its place among the report's photos, from 0. */
  declare position: number
}

export function initReportPhoto(sequelize: Sequelize): void {
  ReportPhoto.init(
    {
      reportId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
      uploadId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
      position: { type: DataTypes.INTEGER, allowNull: false },
    },
    { sequelize, tableName: 'report_photos', modelName: 'ReportPhoto', timestamps: false },
  )
}
