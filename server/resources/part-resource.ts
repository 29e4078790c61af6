import type { z } from 'zod'
import { ApiError } from '../http/errors'
import type { accessories, amplifiers, packs, speakers } from '../db/schema-resources'
import type { SavedItemMeta } from '../../shared/schemas/resources'
import type { OwnedRows, OwnedValues } from './owned-table'
import type { PartUsage } from './part-usage'
import type { ItemBody, ResourceDefinition } from './resource-definition'

type PartTable = typeof packs | typeof amplifiers | typeof speakers | typeof accessories

interface PartOptions<Table extends PartTable, Body> {
  rows: OwnedRows<Table>
  noun: string
  idParam: string
  createSchema: z.ZodType<Body>
  updateSchema: z.ZodType<Body & { version: number }>
  usage: PartUsage
  /** The row for a body, written for the concrete table: `{ ...owned, spec: partSpecOf(body) }`. */
  values(body: Body, owned: OwnedValues): Table['$inferInsert']
}

type PartSpec<Table extends PartTable> = Table['$inferSelect']['spec']

/** A part's engine fields: its body without the item's own name and notes. */
export function partSpecOf<Body extends ItemBody>(body: Body): Omit<Body, keyof ItemBody> {
  const { name: _name, notes: _notes, ...spec } = body
  return spec
}

function quoted(names: { name: string }[]): string {
  return names.map((rig) => `"${rig.name}"`).join(', ')
}

/**
 * A part of the team's library: the body is the engine's part fields plus name and notes, kept as
 * the `spec` column. Deleting a part that rigs still use is refused for editors (403 naming the
 * rigs); an admin's delete detaches it from those rigs in the same transaction and says which.
 */
export function partDefinition<Table extends PartTable, Body extends ItemBody>(
  options: PartOptions<Table, Body>,
): ResourceDefinition<Table, Body, SavedItemMeta & PartSpec<Table>> {
  const { noun, usage } = options
  return {
    rows: options.rows,
    noun,
    idParam: options.idParam,
    createSchema: options.createSchema,
    updateSchema: options.updateSchema,
    values: options.values,
    bodyOf: (_tx, row) => ({ ...row.spec, name: row.name, notes: row.notes }),
    toItem: (_tx, row, meta) => ({ ...row.spec, ...meta }),
    beforeDelete: (scope, row, membership) => {
      const using = usage.rigsUsing(scope.tx, scope.teamId, row.id)
      if (using.length === 0) return undefined
      // docs/api.md: deleting a part in use is an admin's call (it detaches the part from the rigs).
      if (membership.role !== 'admin') {
        throw new ApiError(
          403,
          'part-in-use',
          `This ${noun} is used by ${using.length === 1 ? 'the rig' : `${using.length} rigs:`} ${quoted(using)}. Take it out of ${using.length === 1 ? 'that rig' : 'those rigs'} first, or ask a team admin to delete it (which detaches it and leaves the rigs their copied values).`,
        )
      }
      usage.detach(
        scope.tx,
        row.id,
        using.map((rig) => rig.id),
        scope,
      )
      return { detachedRigs: using }
    },
  }
}
