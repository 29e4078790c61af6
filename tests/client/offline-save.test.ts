import { afterEach, describe, expect, it, vi } from 'vitest'
import { apiRequest } from '@/api/http'
import { previewEvent } from '@/api/events'

// A save that never reached the server must not look like a save: the crew would walk away
// believing the team has the change (product requirement: "Save while offline says it cannot
// reach the server and that nothing was saved").

function offline(): void {
  // What fetch does without a network: it rejects with a TypeError before any answer.
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => {
      throw new TypeError('Failed to fetch')
    }),
  )
}

describe('a request that cannot reach the server', () => {
  afterEach(() => vi.unstubAllGlobals())

  it('says a save was not saved, for every kind of write', async () => {
    offline()
    for (const method of ['POST', 'PUT', 'PATCH'] as const) {
      await expect(apiRequest('/v1/teams/7/plans/1', { method, body: {} })).rejects.toThrow(
        'The server could not be reached, so nothing was saved.',
      )
    }
    await expect(apiRequest('/v1/teams/7/plans/1', { method: 'DELETE' })).rejects.toThrow(
      'so nothing was deleted',
    )
  })

  it('does not speak of saving for a read, or for a preview that writes nothing', async () => {
    offline()
    const read = apiRequest('/v1/teams/7/plans')
    await expect(read).rejects.toMatchObject({ code: 'offline' })
    await expect(read).rejects.not.toThrow(/saved/)
    const preview = previewEvent(7, { planIds: [], pool: [], chargers: [] })
    await expect(preview).rejects.toThrow('The server could not be reached.')
    await expect(preview).rejects.not.toThrow(/saved/)
  })
})
