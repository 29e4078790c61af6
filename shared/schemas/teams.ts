import { z } from 'zod'
import { emailSchema, linkTokenSchema } from './auth'
import { singleLineMessage, singleLinePattern } from './single-line'

// Request bodies of /api/v1/teams and /api/v1/invitations, shared by forms and routes.

/** Ordered weakest first: each role can do everything the ones before it can. */
export const teamRoles = ['viewer', 'editor', 'admin'] as const
export type TeamRole = (typeof teamRoles)[number]

export const teamRoleSchema = z.enum(teamRoles, { message: 'Choose viewer, editor or admin' })

export const teamNameSchema = z
  .string({ message: 'Enter a team name' })
  .trim()
  .min(1, 'Enter a team name')
  .max(80, 'Use at most 80 characters')
  .regex(singleLinePattern, singleLineMessage)

export const teamCreateSchema = z.object({ name: teamNameSchema })
export const teamUpdateSchema = z.object({ name: teamNameSchema })
export const memberUpdateSchema = z.object({ role: teamRoleSchema })

export const invitationCreateSchema = z.object({
  email: emailSchema,
  role: teamRoleSchema,
})

export const invitationTokenSchema = z.object({ token: linkTokenSchema })

export type TeamCreateInput = z.infer<typeof teamCreateSchema>
export type TeamUpdateInput = z.infer<typeof teamUpdateSchema>
export type MemberUpdateInput = z.infer<typeof memberUpdateSchema>
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>
