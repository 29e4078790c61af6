// Body and answer of an event plan (docs/api.md: `{ name, rigId, date, startTime, temperatureC?,
// packCount?, schedule }`, plus the swap policy). The day's fields come from the
// estimate request's own schemas, so a message reads the same on the bench and on a plan.
import { z } from 'zod'
import { CLOCK_TIME_PATTERN, isCalendarDate } from '../plans/clock'
import {
  estimateRequestSchema,
  packSchema,
  swapPolicySchema,
  type ScheduleSegment,
  type SwapPolicy,
} from './estimate'
import {
  resourceNameSchema,
  resourceNotesSchema,
  versionFieldSchema,
  type PlanSummary,
  type SavedItemMeta,
} from './resources'

const rigIdMessage = 'Rig must be the id of one of the team’s saved rigs'

export const planDateSchema = z
  .string({ error: 'Date must be a calendar date written YYYY-MM-DD' })
  .refine(isCalendarDate, { error: 'Date must be a calendar date written YYYY-MM-DD' })

export const planStartTimeSchema = z
  .string({ error: 'Start time must be a time of day written HH:MM (00:00 to 23:59)' })
  .regex(CLOCK_TIME_PATTERN, {
    error: 'Start time must be a time of day written HH:MM (00:00 to 23:59)',
  })

export const planScheduleSchema = estimateRequestSchema.shape.schedule.unwrap()

export const planBodySchema = z.object(
  {
    name: resourceNameSchema,
    notes: resourceNotesSchema.optional(),
    rigId: z
      .number({ error: rigIdMessage })
      .int({ error: rigIdMessage })
      .positive({ error: rigIdMessage }),
    date: planDateSchema,
    startTime: planStartTimeSchema,
    /** Null or absent: the rig's own temperature (or the engine's default). */
    temperatureC: estimateRequestSchema.shape.temperatureC.unwrap().nullable().optional(),
    /** Null or absent: the rig's own count of packs on hand. */
    packCount: packSchema.shape.count.unwrap().nullable().optional(),
    /** Null or absent: the rig's own policy (swap when a pack is empty, by default). */
    swapPolicy: swapPolicySchema.nullable().optional(),
    schedule: planScheduleSchema,
  },
  { error: 'A plan must be a JSON object' },
)
export const planUpdateSchema = z.intersection(planBodySchema, versionFieldSchema)

export type PlanBody = z.infer<typeof planBodySchema>

export interface PlanItem extends SavedItemMeta {
  rigId: number
  /** The rig's name, for lists and the runtime card. */
  rigName: string
  date: string
  startTime: string
  temperatureC: number | null
  packCount: number | null
  swapPolicy: SwapPolicy | null
  schedule: ScheduleSegment[]
  /** Null only when the plan and its rig no longer pass the schema (after an engine change). */
  summary: PlanSummary | null
}
