import type { Sequelize } from 'sequelize'
import { watchListingChanges } from '@/lib/shop/listing-changes'
import { AdminAuditEntry, initAdminAuditEntry } from './admin-audit-entry'
import { AccountToken, initAccountToken } from './account-token'
import { BookletBuild, initBookletBuild } from './booklet-build'
import { initOutgoingMail, OutgoingMail } from './outgoing-mail'
import { initLicence, Licence } from './licence'
import { initOrder, Order } from './order'
import { initPaymentEvent, PaymentEvent } from './payment-event'
import { initPattern, Pattern } from './pattern'
import { initPatternRevision, PatternRevision } from './pattern-revision'
import { initReport, Report } from './report'
import { initReportMessage, ReportMessage } from './report-message'
import { initReportPhoto, ReportPhoto } from './report-photo'
import { initPatternStateChange, PatternStateChange } from './pattern-state-change'
import { initInvitation, Invitation } from './invitation'
import { initSession, Session } from './session'
import { initSewingProject, SewingProject } from './sewing-project'
import { initSewingStep, SewingStep } from './sewing-step'
import { initUpload, Upload } from './upload'
import { initUser, User } from './user'

export { AccountToken, AdminAuditEntry, OutgoingMail, Pattern, PatternRevision, Session, Upload, User }
export { Invitation, PatternStateChange }
export { Licence, Order, PaymentEvent }
export { Report, ReportMessage, ReportPhoto }
export { BookletBuild }
export { SewingProject, SewingStep }

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
  initOrder(sequelize)
  initLicence(sequelize)
  initPaymentEvent(sequelize)
  initReport(sequelize)
  initReportMessage(sequelize)
  initReportPhoto(sequelize)
  initBookletBuild(sequelize)
  initSewingProject(sequelize)
  initSewingStep(sequelize)

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
  Pattern.hasMany(Report, { foreignKey: 'patternId', onDelete: 'CASCADE' })
  Report.belongsTo(User, { foreignKey: 'testerId', as: 'tester' })
  Report.hasMany(ReportMessage, { foreignKey: 'reportId', as: 'messages', onDelete: 'CASCADE' })
  ReportMessage.belongsTo(User, { foreignKey: 'authorId', as: 'author' })
  Report.hasMany(ReportPhoto, { foreignKey: 'reportId', as: 'photos', onDelete: 'CASCADE' })
  Order.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' })
  Order.belongsTo(User, { foreignKey: 'buyerId', as: 'buyer' })
  Licence.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' })
  Licence.belongsTo(Order, { foreignKey: 'orderId', as: 'order' })
  BookletBuild.belongsTo(Licence, { foreignKey: 'licenceId', as: 'licence' })
  SewingProject.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' })
  SewingProject.belongsTo(Licence, { foreignKey: 'licenceId', as: 'licence' })
  SewingProject.belongsTo(Invitation, { foreignKey: 'invitationId', as: 'invitation' })

  // What the shop keeps of its pages is dropped on any write to what a listing is made of.
  watchListingChanges([Pattern, User, Upload])
}
