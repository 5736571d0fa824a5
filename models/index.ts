import type { Sequelize } from 'sequelize'
import { AdminAuditEntry, initAdminAuditEntry } from './admin-audit-entry'
import { AccountToken, initAccountToken } from './account-token'
import { initOutgoingMail, OutgoingMail } from './outgoing-mail'
import { initPattern, Pattern } from './pattern'
import { initPatternRevision, PatternRevision } from './pattern-revision'
import { initSession, Session } from './session'
import { initUpload, Upload } from './upload'
import { initUser, User } from './user'

export { AccountToken, AdminAuditEntry, OutgoingMail, Pattern, PatternRevision, Session, Upload, User }

/** Binds every model to one Sequelize instance and declares how they relate. */
export function initModels(sequelize: Sequelize): void {
  initUser(sequelize)
  initSession(sequelize)
  initPattern(sequelize)
  initPatternRevision(sequelize)
  initUpload(sequelize)
  initOutgoingMail(sequelize)
  initAdminAuditEntry(sequelize)
  initAccountToken(sequelize)

  User.hasMany(Session, { foreignKey: 'userId', onDelete: 'CASCADE' })
  Session.belongsTo(User, { foreignKey: 'userId' })
  User.hasMany(Pattern, { foreignKey: 'ownerId' })
  Pattern.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' })
  Pattern.hasMany(PatternRevision, { foreignKey: 'patternId', onDelete: 'CASCADE' })
  PatternRevision.belongsTo(Pattern, { foreignKey: 'patternId' })
  User.hasMany(Upload, { foreignKey: 'ownerId', onDelete: 'CASCADE' })
  User.hasMany(AccountToken, { foreignKey: 'userId', onDelete: 'CASCADE' })
}
