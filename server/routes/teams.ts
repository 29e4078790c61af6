import { Router } from 'express'
import { eq } from 'drizzle-orm'
import {
  invitationCreateSchema,
  memberUpdateSchema,
  teamCreateSchema,
  teamUpdateSchema,
} from '../../shared/schemas/teams'
import type { TeamView } from '../../shared/schemas/account-responses'
import { createTeamWithAdmin } from '../auth/accounts'
import type { AccountsContext } from '../auth/context'
import { requireTeamRole, requireUser, signedInUser, teamMembership } from '../auth/require'
import { teamsOf } from '../auth/memberships'
import { teams } from '../db/schema'
import { ApiError, parseInput } from '../http/errors'
import { securityEvent } from '../http/log'
import { rowIdParam } from '../http/params'
import { hourMs, throttle } from '../http/throttle'
import { linkTo, invitationMail } from '../mail/templates'
import { createInvitation, deleteInvitation, listPendingInvitations } from '../teams/invitations'
import { changeMemberRole, listMembers, removeMember } from '../teams/members'

/** Teams, their members and their invitations: `/api/v1/teams`. */
export function teamsRouter(context: AccountsContext): Router {
  const { db, clock, mail } = context
  const router = Router()

  function teamView(teamId: number, role: TeamView['role']): TeamView {
    const team = db.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId)).get()
    if (!team)
      throw new ApiError(404, 'team-not-found', 'No such team, or you are not a member of it.')
    return { id: teamId, name: team.name, role }
  }

  const userIdParam = (req: Parameters<typeof rowIdParam>[0]) =>
    rowIdParam(req, 'userId', 'This person is not a member of the team.')

  router.get('/', requireUser, (req, res) => {
    res.json({ teams: teamsOf(db, signedInUser(req).user.id) })
  })

  router.post('/', requireUser, (req, res) => {
    const input = parseInput(teamCreateSchema, req.body)
    const userId = signedInUser(req).user.id
    const teamId = db.transaction((tx) =>
      createTeamWithAdmin(tx, input.name, userId, clock().getTime()),
    )
    res.status(201).json({ team: teamView(teamId, 'admin') })
  })

  router.get('/:teamId', requireTeamRole('viewer'), (req, res) => {
    const { teamId, role } = teamMembership(req)
    res.json({ team: teamView(teamId, role) })
  })

  router.patch('/:teamId', requireTeamRole('admin'), (req, res) => {
    const { teamId, role } = teamMembership(req)
    const input = parseInput(teamUpdateSchema, req.body)
    db.update(teams)
      .set({ name: input.name, updatedAtMs: clock().getTime() })
      .where(eq(teams.id, teamId))
      .run()
    res.json({ team: teamView(teamId, role) })
  })

  router.get('/:teamId/members', requireTeamRole('viewer'), (req, res) => {
    res.json({ members: listMembers(db, teamMembership(req).teamId) })
  })

  router.patch('/:teamId/members/:userId', requireTeamRole('admin'), (req, res) => {
    const { teamId } = teamMembership(req)
    const input = parseInput(memberUpdateSchema, req.body)
    const member = changeMemberRole(db, teamId, userIdParam(req), input.role)
    securityEvent(req, 'role-changed', { teamId, memberId: member.userId, role: member.role })
    res.json({ member })
  })

  // Admins remove anyone; every member may remove themselves (leave the team).
  router.delete('/:teamId/members/:userId', requireTeamRole('viewer'), (req, res) => {
    const { teamId, role } = teamMembership(req)
    const userId = userIdParam(req)
    if (userId !== signedInUser(req).user.id && role !== 'admin') {
      throw new ApiError(403, 'role-too-low', 'Only admins can remove other members.')
    }
    removeMember(db, teamId, userId)
    securityEvent(req, 'member-removed', { teamId, memberId: userId })
    res.status(204).end()
  })

  router.get('/:teamId/invitations', requireTeamRole('admin'), (req, res) => {
    res.json({
      invitations: listPendingInvitations(db, teamMembership(req).teamId, clock().getTime()),
    })
  })

  router.post(
    '/:teamId/invitations',
    requireTeamRole('admin'),
    throttle({
      name: 'invitations',
      windowMs: hourMs,
      // Ours: enough to bring a whole crew in at once, too few to use the app as a mailer.
      limit: 30,
      key: (req) => (req.auth ? String(req.auth.user.id) : undefined),
      message:
        'Too many invitations sent from this account in the last hour. Wait a while and try again.',
    }),
    async (req, res) => {
      const { teamId, role } = teamMembership(req)
      const input = parseInput(invitationCreateSchema, req.body)
      const inviter = signedInUser(req).user
      const { invitation, token } = createInvitation(
        db,
        teamId,
        inviter.id,
        input,
        clock().getTime(),
      )
      try {
        await mail.send(
          invitationMail({
            to: invitation.email,
            teamId,
            teamName: teamView(teamId, role).name,
            inviterName: inviter.name,
            role: invitation.role,
            url: linkTo(context.publicUrl, '/invitations/accept', token),
          }),
        )
      } catch (error) {
        // An invitation nobody was told about would sit in the pending list looking sent.
        deleteInvitation(db, teamId, invitation.id)
        context.log(error)
        throw new ApiError(
          502,
          'mail-failed',
          'The invitation could not be e-mailed; nothing was saved. Try again later.',
        )
      }
      securityEvent(req, 'invitation-sent', {
        teamId,
        invitationId: invitation.id,
        role: invitation.role,
      })
      res.status(201).json({ invitation })
    },
  )

  router.delete('/:teamId/invitations/:invitationId', requireTeamRole('admin'), (req, res) => {
    const invitationId = rowIdParam(req, 'invitationId', 'No such pending invitation in this team.')
    if (!deleteInvitation(db, teamMembership(req).teamId, invitationId)) {
      throw new ApiError(404, 'not-found', 'No such pending invitation in this team.')
    }
    res.status(204).end()
  })

  return router
}
