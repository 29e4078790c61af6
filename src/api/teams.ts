import type {
  InvitationPreview,
  InvitationView,
  MemberView,
  OutboxMessageView,
  TeamView,
} from '@shared/schemas/account-responses'
import type {
  InvitationCreateInput,
  MemberUpdateInput,
  TeamCreateInput,
  TeamUpdateInput,
} from '@shared/schemas/teams'
import { apiRequest } from './http'

// Teams, members, invitations and the local mail catcher (docs/api.md, "Teams").

export const createTeam = (input: TeamCreateInput) =>
  apiRequest<{ team: TeamView }>('/v1/teams', { method: 'POST', body: input })

export const renameTeam = (teamId: number, input: TeamUpdateInput) =>
  apiRequest<{ team: TeamView }>(`/v1/teams/${teamId}`, { method: 'PATCH', body: input })

export const listMembers = (teamId: number) =>
  apiRequest<{ members: MemberView[] }>(`/v1/teams/${teamId}/members`)

export const changeMemberRole = (teamId: number, userId: number, input: MemberUpdateInput) =>
  apiRequest<{ member: MemberView }>(`/v1/teams/${teamId}/members/${userId}`, {
    method: 'PATCH',
    body: input,
  })

export const removeMember = (teamId: number, userId: number) =>
  apiRequest<void>(`/v1/teams/${teamId}/members/${userId}`, { method: 'DELETE' })

export const listInvitations = (teamId: number) =>
  apiRequest<{ invitations: InvitationView[] }>(`/v1/teams/${teamId}/invitations`)

export const inviteMember = (teamId: number, input: InvitationCreateInput) =>
  apiRequest<{ invitation: InvitationView }>(`/v1/teams/${teamId}/invitations`, {
    method: 'POST',
    body: input,
  })

export const revokeInvitation = (teamId: number, invitationId: number) =>
  apiRequest<void>(`/v1/teams/${teamId}/invitations/${invitationId}`, { method: 'DELETE' })

export const previewInvitation = (token: string) =>
  apiRequest<{ invitation: InvitationPreview }>('/v1/invitations/preview', {
    method: 'POST',
    body: { token },
  })

export const acceptInvitation = (token: string) =>
  apiRequest<{ team: TeamView }>('/v1/invitations/accept', { method: 'POST', body: { token } })

export const listOutbox = () => apiRequest<{ messages: OutboxMessageView[] }>('/v1/dev/outbox')
