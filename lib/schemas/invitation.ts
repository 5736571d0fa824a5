import { z } from 'zod'
import { emailSchema } from './account'

/** `POST /api/patterns/:id/invitations`: the address a designer invites to test the pattern. */
export const createInvitationSchema = z.object({ email: emailSchema }).strict()
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>

/**
 * Where an invitation stands: waiting for its address's owner to sign up or confirm the address,
 * accepted (a tester now), expired, or withdrawn by the designer.
 */
export type InvitationState = 'waiting' | 'accepted' | 'expired' | 'withdrawn'

/** One invitation, as its designer sees it (the answers of /api/patterns/:id/invitations). */
export interface InvitationView {
  readonly id: string
  readonly email: string
  readonly state: InvitationState
  /** The tester's display name once accepted. */
  readonly testerName: string | null
  readonly createdAt: string
  readonly expiresAt: string
}
