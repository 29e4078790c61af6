import type {
  CardEmailBody,
  CardEmailResponse,
  CreatedShareLink,
  PlanCardResponse,
  ShareLinkBody,
  ShareLinkList,
  SharedCardResponse,
} from '../../shared/card/schemas'
import { apiRequest } from './http'

// A plan's runtime card, its share links and card e-mails (design/api.md, "Plans and packs"),
// and the public card behind a link ("Public": GET /api/v1/shared/:token).

const planBase = (teamId: number, planId: number) => `/v1/teams/${teamId}/plans/${planId}`

export const getPlanCard = (teamId: number, planId: number) =>
  apiRequest<PlanCardResponse>(`${planBase(teamId, planId)}/card`)

export const listShareLinks = (teamId: number, planId: number) =>
  apiRequest<ShareLinkList>(`${planBase(teamId, planId)}/share-links`)

export const createShareLink = (teamId: number, planId: number, body: ShareLinkBody) =>
  apiRequest<CreatedShareLink>(`${planBase(teamId, planId)}/share-links`, { method: 'POST', body })

export const revokeShareLink = (teamId: number, planId: number, linkId: number) =>
  apiRequest<void>(`${planBase(teamId, planId)}/share-links/${linkId}`, { method: 'DELETE' })

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
