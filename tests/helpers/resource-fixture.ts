import type { Express } from 'express'
import request from 'supertest'
import type { Queryable } from '../../server/db/queryable'
import { insertOwnedItem } from '../../server/resources/resource-definition'
import { accessoryDefinition } from '../../server/resources/accessories'
import { amplifierDefinition } from '../../server/resources/amplifiers'
import { packDefinition } from '../../server/resources/packs'
import { rigDefinition } from '../../server/resources/rigs'
import { speakersDefinition } from '../../server/resources/speakers'
import type { EstimateRequest } from '../../shared/schemas/estimate'
import {
  accessoryBodySchema,
  amplifierBodySchema,
  packBodySchema,
  rigBodySchema,
  speakersBodySchema,
  type AccessoryBody,
  type AmplifierBody,
  type PackBody,
  type SpeakersBody,
} from '../../shared/schemas/resources'

// Datasheet-style parts for API tests. Values are invented but physical.

/** A "40 V max" tool pack: 10 Li-ion cells in series, 36 V nominal (common practice), 2P of 2.5 Ah. */
export const packBody = {
  name: 'Tool pack 36 V 5 Ah',
  chemistry: 'li-ion',
  seriesCells: 10,
  parallelCells: 2,
  cellCapacityAh: 2.5,
  cellResistanceOhm: 0.022,
  cutoffCellV: 3,
  maxDischargeA: 30,
  massKg: 1.4,
  price: 200,
} satisfies Omit<PackBody, 'label'>

export const amplifierBody = {
  name: 'Class D stereo board',
  class: 'd',
  bridged: true,
  channels: 2,
  ratedPowerW: 50,
  ratedLoadOhm: 4,
  ratedSupplyV: 24,
  ratedThdPct: 1,
  supplyMinV: 8,
  supplyMaxV: 42,
} satisfies AmplifierBody

export const speakersBody = {
  name: 'One 8 ohm full-range driver per side',
  driverOhm: 8,
  parallel: 1,
  banks: 1,
  sensitivityDb: 90,
} satisfies SpeakersBody

export const accessoryBody = {
  name: 'Wireless mic receiver',
  powerW: 3,
  inputMinV: 9,
  inputMaxV: 15,
  feed: 'buck',
  outputV: 12,
} satisfies Omit<AccessoryBody, 'label'>

function partSpec<Body extends { name: string }>(body: Body, labelled: boolean) {
  const { name, ...spec } = body
  return labelled ? { ...spec, label: name } : spec
}

/** A rig spec with no lists in it (the matrix fills placeholders in plain objects only). */
export const plainRigSpec: EstimateRequest = {
  pack: partSpec(packBody, true) as EstimateRequest['pack'],
  amplifier: partSpec(amplifierBody, false) as EstimateRequest['amplifier'],
  speakers: partSpec(speakersBody, false) as EstimateRequest['speakers'],
  // Rock and pop sit at a crest factor of about 12 dB (docs/model.md §5, common practice).
  programme: { crestFactorDb: 12, peakBelowClipDb: 6 },
}

export const rigSpecWithAccessory: EstimateRequest = {
  ...plainRigSpec,
  accessories: [partSpec(accessoryBody, true) as NonNullable<EstimateRequest['accessories']>[0]],
}

export interface ResourceIds {
  packId: string
  amplifierId: string
  speakersId: string
  accessoryId: string
  rigId: string
}

/** One of each part and a rig built from all of them, for `:packId` … `:rigId` placeholders. */
export function seedResourceFixture(
  db: Queryable,
  teamId: number,
  userId: number,
  nowMs: number,
): ResourceIds {
  const scope = { tx: db, teamId, userId, nowMs }
  const packId = insertOwnedItem(scope, packDefinition, packBodySchema.parse(packBody))
  const amplifierId = insertOwnedItem(
    scope,
    amplifierDefinition,
    amplifierBodySchema.parse(amplifierBody),
  )
  const speakersId = insertOwnedItem(
    scope,
    speakersDefinition,
    speakersBodySchema.parse(speakersBody),
  )
  const accessoryId = insertOwnedItem(
    scope,
    accessoryDefinition,
    accessoryBodySchema.parse(accessoryBody),
  )
  const rigId = insertOwnedItem(
    scope,
    rigDefinition,
    rigBodySchema.parse({
      name: 'Market stage column',
      spec: rigSpecWithAccessory,
      packId,
      amplifierId,
      speakersId,
      accessoryIds: [accessoryId],
    }),
  )
  return {
    packId: String(packId),
    amplifierId: String(amplifierId),
    speakersId: String(speakersId),
    accessoryId: String(accessoryId),
    rigId: String(rigId),
  }
}

type Method = 'get' | 'post' | 'put' | 'delete'

/** Requests to `/api/v1/teams/<team>/…` as one actor of a team fixture. */
export function teamApi(app: Express, teamId: string, cookie: string) {
  const call = (method: Method, path: string, body?: unknown) => {
    const pending = request(app)[method](`/api/v1/teams/${teamId}${path}`).set('Cookie', cookie)
    return body === undefined ? pending : pending.send(body as object)
  }
  return {
    get: (path: string) => call('get', path),
    post: (path: string, body?: unknown) => call('post', path, body ?? {}),
    put: (path: string, body: unknown) => call('put', path, body),
    delete: (path: string) => call('delete', path),
  }
}
