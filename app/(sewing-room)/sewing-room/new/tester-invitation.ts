import 'server-only'
import { Op } from 'sequelize'
import { database } from '@/lib/db'
import { Invitation } from '@/models'

/**
 * The id of the person's live, accepted invitation to test the pattern, which a tester's project
 * is started under (`POST /api/sewing-room/projects { invitationId }`). The tester's pages know the
 * pattern, not the invitation. Only reads the actor's own row; whether they may start a project
 * under it is the service's to decide (lib/services/sewing-room.ts, through lib/authorization.ts).
 */
export async function liveInvitationIdOf(userId: string, patternId: string): Promise<string | null> {
  database()
  const invitation = await Invitation.findOne({
    where: { userId, patternId, acceptedAt: { [Op.ne]: null }, withdrawnAt: null, expiresAt: { [Op.gt]: new Date() } },
    attributes: ['id'],
    order: [['createdAt', 'DESC']],
  })
  return invitation?.id ?? null
}
