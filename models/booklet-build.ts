import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize'
import type { Licence } from './licence'

/** Where a buyer's booklet is: waiting for the worker, being written, in the store, or given up. */
export type BookletBuildState = 'queued' | 'building' | 'ready' | 'failed'

/**
 * A booklet built on the server for a licence holder (migrations/20261202-0140-…): its options,
 * the cache key that lets the same request be answered from the store, progress and the stored
 * PDF's object key.
 */
export class BookletBuild extends Model<InferAttributes<BookletBuild>, InferCreationAttributes<BookletBuild>> {
  declare id: string
  declare licenceId: string
  declare userId: string
  declare patternId: string
  declare patternRevision: number
  declare options: Record<string, unknown>
  declare cacheKey: string
  declare state: CreationOptional<BookletBuildState>
  declare pagesDone: CreationOptional<number>
  declare pageCount: CreationOptional<number | null>
  declare objectKey: CreationOptional<string | null>
  declare byteSize: CreationOptional<number | null>
  declare error: CreationOptional<string | null>
  declare builtBy: CreationOptional<string | null>
  declare attempts: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare startedAt: CreationOptional<Date | null>
  declare finishedAt: CreationOptional<Date | null>
  /** Its licence, when a query includes it (`as: 'licence'`). */
  declare licence?: NonAttribute<Licence>
}

export function initBookletBuild(sequelize: Sequelize): void {
  BookletBuild.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      licenceId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      patternId: { type: DataTypes.UUID, allowNull: false },
      patternRevision: { type: DataTypes.INTEGER, allowNull: false },
      options: { type: DataTypes.JSONB, allowNull: false },
      cacheKey: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
      pagesDone: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      pageCount: { type: DataTypes.INTEGER, allowNull: true },
      objectKey: { type: DataTypes.TEXT, allowNull: true },
      byteSize: { type: DataTypes.INTEGER, allowNull: true },
      error: { type: DataTypes.TEXT, allowNull: true },
      builtBy: { type: DataTypes.TEXT, allowNull: true },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      startedAt: { type: DataTypes.DATE, allowNull: true },
      finishedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: 'booklet_builds', modelName: 'BookletBuild', timestamps: false },
  )
}
