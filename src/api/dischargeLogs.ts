import type { PackHealthEffect } from '@shared/discharge/health-effect'
import type { PackItem } from '@shared/schemas/resources'
import {
  DISCHARGE_LOG_FIELD,
  type AcceptDischargeLogInput,
  type DischargeLogDetail,
  type DischargeLogSummary,
} from '@shared/discharge/log'
import { ApiRequestError, apiRequest, reportUnauthorized, unreachableError } from './http'

// A saved pack's measured discharges (docs/api.md, "The team's parts, rigs and plans").

const base = (teamId: number, packId: number) =>
  `/v1/teams/${teamId}/packs/${packId}/discharge-logs`

export const listDischargeLogs = (teamId: number, packId: number) =>
  apiRequest<{ items: DischargeLogSummary[]; total: number }>(base(teamId, packId))

export const getDischargeLog = (teamId: number, packId: number, logId: number) =>
  apiRequest<DischargeLogDetail>(`${base(teamId, packId)}/${logId}`)

export const deleteDischargeLog = (teamId: number, packId: number, logId: number) =>
  apiRequest<void>(`${base(teamId, packId)}/${logId}`, { method: 'DELETE' })

/** Which rigs and plans would take the log's health figure now, and why the others would not. */
export const previewAcceptDischargeLog = (teamId: number, packId: number, logId: number) =>
  apiRequest<PackHealthEffect>(`${base(teamId, packId)}/${logId}/accept-preview`)

export const acceptDischargeLog = (
  teamId: number,
  packId: number,
  logId: number,
  input: AcceptDischargeLogInput,
) =>
  apiRequest<{
    pack: PackItem
    log: DischargeLogDetail
    /** The rigs using the pack, which now run with its measured health too. */
    updatedRigs: { id: number; name: string }[]
    /** What the figure reached, and what kept its own (as the preview says it). */
    effect: PackHealthEffect
  }>(`${base(teamId, packId)}/${logId}/accept`, {
    method: 'POST',
    body: input,
  })

function requestError(status: number, payload: unknown): ApiRequestError {
  const error = (payload as { error?: { code?: string; message?: string } } | undefined)?.error
  return new ApiRequestError(
    status,
    error?.code ?? `http-${status}`,
    error?.message ?? `The server answered ${status}.`,
  )
}

/**
 * Uploads a log file; `onProgress` gets the fraction sent (0..1). XMLHttpRequest rather than
 * fetch because only it reports upload progress in every current browser.
 */
export function uploadDischargeLog(
  teamId: number,
  packId: number,
  file: File,
  onProgress: (fraction: number) => void,
): Promise<DischargeLogDetail> {
  const form = new FormData()
  form.append(DISCHARGE_LOG_FIELD, file, file.name)
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', `/api${base(teamId, packId)}`)
    xhr.responseType = 'json'
    xhr.upload.addEventListener('progress', (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total)
    })
    xhr.addEventListener('load', () => {
      if (xhr.status === 201) {
        onProgress(1)
        resolve(xhr.response as DischargeLogDetail)
        return
      }
      // The session ended meanwhile: to sign-in and back, as for every other request.
      if (xhr.status === 401) reportUnauthorized()
      reject(requestError(xhr.status, xhr.response))
    })
    xhr.addEventListener('error', () => reject(unreachableError('saved')))
    xhr.send(form)
  })
}
