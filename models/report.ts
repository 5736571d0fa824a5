import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { ReportPin } from '@/lib/report-place'
import type { ReportKind, ReportPlace, ReportSeverity, ReportState } from '@/lib/schemas/report'

/** A tester's report on a pattern (migrations/20261202-0110-create-test-reports.ts). */
export class Report extends Model<InferAttributes<Report>, InferCreationAttributes<Report>> {
  declare id: CreationOptional<string>
  declare patternId: string
  /** Null once the tester's account is deleted. */
  declare testerId: string | null
  declare kind: ReportKind
  declare severity: ReportSeverity
  declare text: string
  /** The place as the tester named it. */
  declare place: ReportPlace
  /** Its pin as worked out when filed; null for a page alone. */
  declare pin: ReportPin | null
  declare state: CreationOptional<ReportState>
  /** The pattern's revision it was filed against. */
  declare revision: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initReport(sequelize: Sequelize): void {
  Report.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      patternId: { type: DataTypes.UUID, allowNull: false },
      testerId: { type: DataTypes.UUID, allowNull: true },
      kind: { type: DataTypes.TEXT, allowNull: false },
      severity: { type: DataTypes.TEXT, allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      place: { type: DataTypes.JSONB, allowNull: false },
      pin: { type: DataTypes.JSONB, allowNull: true },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'reports', modelName: 'Report' },
  )
}
