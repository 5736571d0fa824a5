import { z } from 'zod'
import { emailSchema } from './account'

/** `POST /api/patterns/:id/invitations`: the address a designer invites to test the pattern. */
export const createInvitationSchema = z.object({ email: emailSchema }).strict()
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>

/**
 * Where an invitation stands: waiting for its address's owner to sign up or confirm the address,
 * accepted (a tester now), expired, or withdrawn by the designer.
 */
export const INVITATION_STATES = ['waiting', 'accepted', 'expired', 'withdrawn'] as const
export type InvitationState = (typeof INVITATION_STATES)[number]

/** One invitation, as its designer sees it. */
export const invitationViewSchema = z.object({
  id: z.string(),
  email: z.string(),
  state: z.enum(INVITATION_STATES),
  /** The tester's display name once accepted. */
  testerName: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
})
export type InvitationView = z.infer<typeof invitationViewSchema>

export const invitationAnswerSchema = z.object({ invitation: invitationViewSchema })
export const invitationListAnswerSchema = z.object({ invitations: z.array(invitationViewSchema) })
