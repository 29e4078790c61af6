// `POST /api/v1/compare` (docs/estimate-api.md, "Comparing packs"): one rig against
// many packs. One schema for the client and the server.
import { z } from 'zod'
import { AIRLINE_CLASSES, CONVERTER_VERDICTS, estimateRequestSchema, packSchema } from './estimate'

/** Most packs one comparison runs (each is a full estimate, so the route stays cheap to call). */
export const MAX_COMPARED_PACKS = 60

export const compareRequestSchema = z.object(
  {
    rig: estimateRequestSchema,
    packs: z
      .array(packSchema, { error: 'Packs must be a list of packs to compare' })
      .min(1, { error: 'Give at least one pack to compare' })
      .max(MAX_COMPARED_PACKS, {
        error: `At most ${MAX_COMPARED_PACKS} packs can be compared at once`,
      }),
  },
  { error: 'The comparison must be a JSON object with a rig and a list of packs' },
)
export type CompareRequest = z.infer<typeof compareRequestSchema>

const finite = z.number()

export const compareRowSchema = z.object({
  fits: z.boolean(),
  problems: z.array(z.object({ code: z.string(), message: z.string() })),
  runtimeHours: finite,
  lasts: z.boolean().optional(),
  energyWh: z.object({ nominal: finite, delivered: finite }),
  whPerKg: finite.optional(),
  costPerHour: finite.optional(),
  minimumHeadroomDb: finite,
  airlineClass: z.enum(AIRLINE_CLASSES),
  converterNeeds: z.array(
    z.object({
      label: z.string(),
      verdict: z.enum(CONVERTER_VERDICTS),
      fits: z.boolean(),
      advice: z.string(),
    }),
  ),
})
export type CompareRow = z.infer<typeof compareRowSchema>

export const compareResultSchema = z.object({ rows: z.array(compareRowSchema) })
