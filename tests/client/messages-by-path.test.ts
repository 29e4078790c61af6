import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { dottedPath, messagesByPath } from '@/display/messagesByPath'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import { exampleRigs } from '../../shared/library'

// Field messages by the dotted path every form looks them up by. Source for the issue shape: the
// zod 4 documentation ("ZodError": each issue has a `path`, an array of the keys and array
// indices that lead to the value, and a `message`); the API's issues carry the path already
// dotted (docs/api.md, error shape).

describe('messages by field path', () => {
  it('names nested fields and list items by their dotted path', () => {
    const rig = structuredClone(exampleRigs[0]!.rig)
    rig.pack.parallelCells = 0
    rig.accessories = [{ label: 'Mixer', powerW: -1, inputMinV: 9, inputMaxV: 15, feed: 'direct' }]
    const parsed = estimateRequestSchema.safeParse(rig)
    expect(parsed.success).toBe(false)
    const messages = messagesByPath(parsed.success ? [] : parsed.error.issues)
    expect([...messages.keys()]).toEqual(['pack.parallelCells', 'accessories.0.powerW'])
    expect(messages.get('pack.parallelCells')).toMatch(/^Cells in parallel/)
    expect(messages.get('accessories.0.powerW')).toMatch(/^Accessory power/)
  })

  it('keeps the first message of a field, the one to fix first', () => {
    // zod runs a string's checks in the order they are declared and reports every failure.
    const schema = z.object({ code: z.string().min(8, 'too short').regex(/\d/, 'needs a digit') })
    const parsed = schema.safeParse({ code: 'abc' })
    expect(parsed.success).toBe(false)
    if (parsed.success) return
    expect(parsed.error.issues).toHaveLength(2)
    expect(messagesByPath(parsed.error.issues)).toEqual(new Map([['code', 'too short']]))
  })

  it('puts the messages given first ahead of the issues, for the same field and in order', () => {
    const unreadable = new Map([['pack.count', '“two” is not a number']])
    const messages = messagesByPath(
      [
        { path: ['pack', 'count'], message: 'Packs must be at least 1' },
        { path: ['name'], message: 'Give the rig a name' },
      ],
      unreadable,
    )
    expect([...messages]).toEqual([
      ['pack.count', '“two” is not a number'],
      ['name', 'Give the rig a name'],
    ])
    // The map given first is read, never written.
    expect(unreadable.size).toBe(1)
  })

  it('takes the API’s dotted paths as they come', () => {
    const messages = messagesByPath([{ path: 'rigId', message: 'No such rig in this team' }])
    expect(messages.get('rigId')).toBe('No such rig in this team')
    expect(dottedPath(['schedule', 2, 'minutes'])).toBe('schedule.2.minutes')
    expect(dottedPath([])).toBe('')
  })
})
