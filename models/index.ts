import type { Sequelize } from 'sequelize'
import { initPattern, Pattern } from './pattern'
import { initPatternRevision, PatternRevision } from './pattern-revision'
import { initSession, Session } from './session'
import { initUser, User } from './user'

export { Pattern, PatternRevision, Session, User }

/** Binds every model to one Sequelize instance and declares how they relate. */
export function initModels(sequelize: Sequelize): void {
  initUser(sequelize)
  initSession(sequelize)
  initPattern(sequelize)
  initPatternRevision(sequelize)

  User.hasMany(Session, { foreignKey: 'userId', onDelete: 'CASCADE' })
  Session.belongsTo(User, { foreignKey: 'userId' })
  User.hasMany(Pattern, { foreignKey: 'ownerId' })
  Pattern.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' })
  Pattern.hasMany(PatternRevision, { foreignKey: 'patternId', onDelete: 'CASCADE' })
  PatternRevision.belongsTo(Pattern, { foreignKey: 'patternId' })
}
