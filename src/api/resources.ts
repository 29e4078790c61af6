import type {
  AccessoryBody,
  AccessoryItem,
  AmplifierBody,
  AmplifierItem,
  DetachedRigs,
  ListQuery,
  ListResponse,
  PackBody,
  PackItem,
  RigBody,
  RigItem,
  SpeakersBody,
  SpeakersItem,
} from '@shared/schemas/resources'
import { apiRequest } from './http'

// The team's parts library and saved rigs (docs/api.md, "The team's parts, rigs and plans").

export type ResourceCollection =
  'packs' | 'amplifiers' | 'speakers' | 'accessories' | 'rigs' | 'plans' | 'events'

/** A body as the client sends it: the server fills in what its schema defaults. */
type Sendable<Body> = Omit<Body, 'label'>

/** `ListItem`: what a list row holds, when the list shows less than one item (events). */
export interface ResourceApi<Item, Body, ListItem = Item> {
  list(teamId: number, query?: Partial<ListQuery>): Promise<ListResponse<ListItem>>
  get(teamId: number, id: number): Promise<Item>
  create(teamId: number, body: Sendable<Body>): Promise<Item>
  /** Sends the version the edit started from; a stale one answers 409 (`stale-version`). */
  update(teamId: number, id: number, body: Sendable<Body> & { version: number }): Promise<Item>
  /** Undefined, or the rigs an admin's delete detached the part from. */
  remove(teamId: number, id: number): Promise<DetachedRigs | undefined>
  duplicate(teamId: number, id: number): Promise<Item>
}

export function resourceApi<Item, Body, ListItem = Item>(
  collection: ResourceCollection,
): ResourceApi<Item, Body, ListItem> {
  const base = (teamId: number) => `/v1/teams/${teamId}/${collection}`
  return {
    list: (teamId, query = {}) =>
      apiRequest<ListResponse<ListItem>>(base(teamId), { query: { ...query } }),
    get: (teamId, id) => apiRequest<Item>(`${base(teamId)}/${id}`),
    create: (teamId, body) => apiRequest<Item>(base(teamId), { method: 'POST', body }),
    update: (teamId, id, body) =>
      apiRequest<Item>(`${base(teamId)}/${id}`, { method: 'PUT', body }),
    remove: (teamId, id) =>
      apiRequest<DetachedRigs | undefined>(`${base(teamId)}/${id}`, { method: 'DELETE' }),
    duplicate: (teamId, id) =>
      apiRequest<Item>(`${base(teamId)}/${id}/duplicate`, { method: 'POST' }),
  }
}

export const packsApi = resourceApi<PackItem, PackBody>('packs')
export const amplifiersApi = resourceApi<AmplifierItem, AmplifierBody>('amplifiers')
export const speakersApi = resourceApi<SpeakersItem, SpeakersBody>('speakers')
export const accessoriesApi = resourceApi<AccessoryItem, AccessoryBody>('accessories')
export const rigsApi = resourceApi<RigItem, RigBody>('rigs')
