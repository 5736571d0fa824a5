import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/** What an upload is for; the same path stores each (lib/services/uploads.ts). */
export const UPLOAD_KINDS = ['fabric-photo', 'swatch', 'cover', 'report-photo'] as const
export type UploadKind = (typeof UPLOAD_KINDS)[number]

/** The image types accepted and stored, each re-encoded by the server in its own type. */
export const IMAGE_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const
export type ImageType = (typeof IMAGE_TYPES)[number]

/** An uploaded image: the object store keeps the bytes under `key`, this row the facts. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<string>
  declare ownerId: string
  declare kind: UploadKind
  declare key: string
  declare contentType: ImageType
  declare width: number
  declare height: number
  declare bytes: number
  /** `#rrggbb` colours proposed from a theme-fabric photo; null for other kinds. */
  declare palette: string[] | null
  declare createdAt: CreationOptional<Date>
}

export function initUpload(sequelize: Sequelize): void {
  Upload.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      key: { type: DataTypes.TEXT, allowNull: false },
      contentType: { type: DataTypes.TEXT, allowNull: false },
      width: { type: DataTypes.INTEGER, allowNull: false },
      height: { type: DataTypes.INTEGER, allowNull: false },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      palette: { type: DataTypes.JSONB, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'uploads', modelName: 'Upload', updatedAt: false },
  )
}
