// Bodies and answers of the team-owned resources (docs/api.md, "The team's parts, rigs and plans"): the parts
// library (packs, amplifiers, speaker sets, accessories) and saved rigs. The server validates
// every write with these and the client forms use the same ones, so a field's message is the same
// on both sides. Part fields come from the engine's own schemas: a saved part drops into an
// estimate request as it is.
import { z } from 'zod'
import { singleLineMessage, singleLinePattern } from './single-line'
import {
  SEVERITIES,
  STOP_REASONS,
  accessorySchema,
  amplifierSchema,
  estimateRequestSchema,
  packSchema,
  speakersSchema,
  type AccessorySpec,
  type AmplifierSpec,
  type EstimateRequest,
  type PackSpec,
  type SpeakersSpec,
} from './estimate'

/**
 * The shape of `rigs.spec` (an estimate request). Bump it, with a data migration, when a change
 * to the estimate request would make stored specs fail the schema.
 */
export const RIG_SPEC_SCHEMA_VERSION = 1

export const RESOURCE_NAME_MAX = 80
export const RESOURCE_NOTES_MAX = 2000

export const resourceNameSchema = z
  .string({ error: (issue) => (issue.input === undefined ? 'Enter a name' : 'Name must be text') })
  .trim()
  .min(1, { error: 'Enter a name' })
  .max(RESOURCE_NAME_MAX, { error: `Use at most ${RESOURCE_NAME_MAX} characters for the name` })
  .regex(singleLinePattern, { error: singleLineMessage })

export const resourceNotesSchema = z
  .string({ error: 'Notes must be text' })
  .max(RESOURCE_NOTES_MAX, { error: `Use at most ${RESOURCE_NOTES_MAX} characters for notes` })

const itemFields = { name: resourceNameSchema, notes: resourceNotesSchema.optional() }

/** Optimistic concurrency: an update names the version it was based on (409 when stale). */
export const versionFieldSchema = z.object({
  version: z
    .number({ error: 'Version must be the whole number you read with the item' })
    .int({ error: 'Version must be the whole number you read with the item' })
    .min(1, { error: 'Version must be the whole number you read with the item' }),
})

function withVersion<S extends z.ZodType>(body: S) {
  return z.intersection(body, versionFieldSchema)
}

// A part's body is its estimate fields plus `name` and `notes` (docs/api.md). A pack's or accessory's
// own `label` is not sent: it is the name, so a part copied into a rig keeps its name there.
function labelledByName<S extends z.ZodType>(schema: S) {
  return z.preprocess((input) => {
    if (typeof input !== 'object' || input === null || Array.isArray(input)) return input
    const name = resourceNameSchema.safeParse((input as { name?: unknown }).name)
    // A bad name is reported at `name` alone: the stand-in label never reaches storage.
    return { ...input, label: name.success ? name.data : 'unnamed' }
  }, schema)
}

export const packBodySchema = labelledByName(packSchema.extend(itemFields))
export const amplifierBodySchema = amplifierSchema.extend(itemFields)
export const speakersBodySchema = speakersSchema.extend(itemFields)
export const accessoryBodySchema = labelledByName(accessorySchema.extend(itemFields))

export const packUpdateSchema = withVersion(packBodySchema)
export const amplifierUpdateSchema = withVersion(amplifierBodySchema)
export const speakersUpdateSchema = withVersion(speakersBodySchema)
export const accessoryUpdateSchema = withVersion(accessoryBodySchema)

const partIdSchema = (label: string) =>
  z
    .number({ error: `${label} must be the id of one of the team's parts, or null` })
    .int({ error: `${label} must be the id of one of the team's parts, or null` })
    .positive({ error: `${label} must be the id of one of the team's parts, or null` })

/**
 * A rig: an estimate request plus the saved parts it was built from. The references are only a
 * record of origin; the spec holds copies, so a later edit of a part does not change the rig.
 */
export const rigBodySchema = z.object({
  ...itemFields,
  spec: estimateRequestSchema,
  packId: partIdSchema('Pack').nullable().optional(),
  amplifierId: partIdSchema('Amplifier').nullable().optional(),
  speakersId: partIdSchema('Speaker set').nullable().optional(),
  accessoryIds: z
    .array(partIdSchema('Accessory'), { error: 'Accessory ids must be a list' })
    .max(20, { error: 'At most 20 accessories' })
    .refine((ids) => new Set(ids).size === ids.length, {
      error: 'Each accessory may be listed once',
    })
    .optional(),
})
export const rigUpdateSchema = withVersion(rigBodySchema)

// ---------- Lists ----------

export const LIST_LIMIT_DEFAULT = 50
export const LIST_LIMIT_MAX = 200
export const SORT_FIELDS = ['name', 'createdAt', 'updatedAt'] as const
export type SortField = (typeof SORT_FIELDS)[number]
const sortValues = SORT_FIELDS.flatMap((field) => [field, `-${field}`])

/** `?limit&offset&sort&q`; `sort` is a field name, with a leading `-` for descending. */
export const listQuerySchema = z.object({
  limit: z.coerce
    .number({ error: `limit must be a whole number from 1 to ${LIST_LIMIT_MAX}` })
    .int({ error: `limit must be a whole number from 1 to ${LIST_LIMIT_MAX}` })
    .min(1, { error: `limit must be a whole number from 1 to ${LIST_LIMIT_MAX}` })
    .max(LIST_LIMIT_MAX, { error: `limit must be a whole number from 1 to ${LIST_LIMIT_MAX}` })
    .default(LIST_LIMIT_DEFAULT),
  offset: z.coerce
    .number({ error: 'offset must be a whole number, 0 or more' })
    .int({ error: 'offset must be a whole number, 0 or more' })
    .min(0, { error: 'offset must be a whole number, 0 or more' })
    .max(1_000_000, { error: 'offset must be at most 1000000' })
    .default(0),
  sort: z
    .string()
    .refine((value) => sortValues.includes(value), {
      error: (issue) =>
        `sort "${String(issue.input)}" is not a sort field; use one of ${sortValues.join(', ')}`,
    })
    .optional(),
  q: z
    .string({ error: 'q must be text' })
    .trim()
    .max(100, { error: 'q must be at most 100 characters' })
    .optional(),
})
export type ListQuery = z.infer<typeof listQuerySchema>

export interface ListResponse<Item> {
  items: Item[]
  total: number
}

// ---------- Answers ----------

export interface PersonRef {
  id: number
  name: string
}

/** What every saved item carries (docs/api.md). Times are ISO 8601 in UTC. */
export interface SavedItemMeta {
  id: number
  version: number
  name: string
  notes: string
  createdAt: string
  updatedAt: string
  createdBy: PersonRef | null
  updatedBy: PersonRef | null
}

export type PackItem = SavedItemMeta & PackSpec
export type AmplifierItem = SavedItemMeta & AmplifierSpec
export type SpeakersItem = SavedItemMeta & SpeakersSpec
export type AccessoryItem = SavedItemMeta & AccessorySpec

/** The headline of an engine result, stored with a rig at each save. */
export const rigSummarySchema = z.object({
  engineVersion: z.string(),
  runtimeHours: z.number(),
  stopReason: z.enum(STOP_REASONS),
  averageDrawW: z.number(),
  warningCount: z.number().int(),
  /** The most serious warning's severity, or null without warnings. */
  worstSeverity: z.enum(SEVERITIES).nullable(),
  /** Only for a rig whose spec carries a schedule. */
  lasts: z.boolean().optional(),
  packsUsed: z.number().int().optional(),
})
export type RigSummary = z.infer<typeof rigSummarySchema>

/** A plan's headline adds whether the day is covered and the swaps on the event clock. */
export const planSummarySchema = rigSummarySchema.extend({
  lasts: z.boolean(),
  packsUsed: z.number().int(),
  swaps: z.array(z.object({ atMinute: z.number(), atTime: z.string() })),
})
export type PlanSummary = z.infer<typeof planSummarySchema>

export interface RigItem extends SavedItemMeta {
  spec: EstimateRequest
  specSchemaVersion: number
  /** Null only when the stored spec no longer passes the schema (see the recompute on start). */
  summary: RigSummary | null
  packId: number | null
  amplifierId: number | null
  speakersId: number | null
  accessoryIds: number[]
}

/** A 409 from deleting a part that rigs still use, or from an admin's delete that detached it. */
export interface DetachedRigs {
  detachedRigs: { id: number; name: string }[]
}

export type PackBody = z.infer<typeof packBodySchema>
export type AmplifierBody = z.infer<typeof amplifierBodySchema>
export type SpeakersBody = z.infer<typeof speakersBodySchema>
export type AccessoryBody = z.infer<typeof accessoryBodySchema>
export type RigBody = z.infer<typeof rigBodySchema>
