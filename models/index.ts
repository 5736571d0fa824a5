import type { Sequelize } from 'sequelize'
import { AdminAuditEntry, initAdminAuditEntry } from './admin-audit-entry'
import { AccountToken, initAccountToken } from './account-token'
import { initOutgoingMail, OutgoingMail } from './outgoing-mail'
import { initPattern, Pattern } from './pattern'
import { initPatternRevision, PatternRevision } from './pattern-revision'
import { initPatternStateChange, PatternStateChange } from './pattern-state-change'
import { initInvitation, Invitation } from './invitation'
import { initSession, Session } from './session'
import { initUpload, Upload } from './upload'
import { initUser, User } from './user'

export { AccountToken, AdminAuditEntry, OutgoingMail, Pattern, PatternRevision, Session, Upload, User }
export { Invitation, PatternStateChange }

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
  initPatternStateChange(sequelize)
  initInvitation(sequelize)

  User.hasMany(Session, { foreignKey: 'userId', onDelete: 'CASCADE' })
  Session.belongsTo(User, { foreignKey: 'userId' })
  User.hasMany(Pattern, { foreignKey: 'ownerId' })
  Pattern.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' })
  Pattern.hasMany(PatternRevision, { foreignKey: 'patternId', onDelete: 'CASCADE' })
  PatternRevision.belongsTo(Pattern, { foreignKey: 'patternId' })
  User.hasMany(Upload, { foreignKey: 'ownerId', onDelete: 'CASCADE' })
  User.hasMany(AccountToken, { foreignKey: 'userId', onDelete: 'CASCADE' })
  Pattern.hasMany(PatternStateChange, { foreignKey: 'patternId', onDelete: 'CASCADE' })
  PatternStateChange.belongsTo(User, { foreignKey: 'changedById', as: 'changedBy' })
  Pattern.hasMany(Invitation, { foreignKey: 'patternId', onDelete: 'CASCADE' })
  Invitation.belongsTo(Pattern, { foreignKey: 'patternId' })
  Invitation.belongsTo(User, { foreignKey: 'userId', as: 'tester' })
}
