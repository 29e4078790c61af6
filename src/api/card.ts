import type {
  CardEmailBody,
  CardEmailResponse,
  CreatedShareLink,
  PlanCardResponse,
  ShareLinkBody,
  ShareLinkList,
  SharedCardResponse,
} from '@shared/card/schemas'
import { apiRequest } from './http'

// A plan's runtime card, its share links and card e-mails (docs/api.md, "The team's parts, rigs and plans"),
// and the public card behind a link ("Public": GET /api/v1/shared/:token).

const planBase = (teamId: number, planId: number) => `/v1/teams/${teamId}/plans/${planId}`

/** Whose share links: a plan's (the default) or an event's. */
export type ShareLinkOwner = 'plans' | 'events'
const ownerBase = (teamId: number, id: number, owner: ShareLinkOwner) =>
  `/v1/teams/${teamId}/${owner}/${id}`

export const getPlanCard = (teamId: number, planId: number) =>
  apiRequest<PlanCardResponse>(`${planBase(teamId, planId)}/card`)

export const listShareLinks = (teamId: number, id: number, owner: ShareLinkOwner = 'plans') =>
  apiRequest<ShareLinkList>(`${ownerBase(teamId, id, owner)}/share-links`)

export const createShareLink = (
  teamId: number,
  id: number,
  body: ShareLinkBody,
  owner: ShareLinkOwner = 'plans',
) =>
  apiRequest<CreatedShareLink>(`${ownerBase(teamId, id, owner)}/share-links`, {
    method: 'POST',
    body,
  })

export const revokeShareLink = (
  teamId: number,
  id: number,
  linkId: number,
  owner: ShareLinkOwner = 'plans',
) => apiRequest<void>(`${ownerBase(teamId, id, owner)}/share-links/${linkId}`, { method: 'DELETE' })

export const emailCard = (teamId: number, planId: number, body: CardEmailBody) =>
  apiRequest<CardEmailResponse>(`${planBase(teamId, planId)}/card-emails`, {
    method: 'POST',
    body,
  })

/** Signed out or in alike; a dead link answers 404. */
export const getSharedCard = (token: string) =>
  apiRequest<SharedCardResponse>(`/v1/shared/${encodeURIComponent(token)}`, {
    quietUnauthorized: true,
  })
