import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { packs, rigAccessories, rigs } from '../../server/db/schema-resources'
import {
  accessoryBody,
  amplifierBody,
  packBody,
  speakersBody,
  teamApi,
} from '../helpers/resource-fixture'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'

// The team's parts library: /api/v1/teams/:teamId/{packs,amplifiers,speakers,accessories}.
// Who may call what is in the authorization matrix; this file checks what the routes do.

let fixture: TeamFixture
let editor: ReturnType<typeof teamApi>
let admin: ReturnType<typeof teamApi>
beforeEach(async () => {
  fixture = await createTeamFixture()
  const teamId = fixture.placeholders.teamId!
  editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
  admin = teamApi(fixture.testApp.app, teamId, fixture.cookies.admin)
})
afterEach(() => fixture.testApp.close())

const packCount = () => fixture.testApp.database.db.$count(packs)

describe('creating and reading parts', () => {
  it('stores a pack from datasheet values and answers 201 with id, version and times', async () => {
    const created = await editor.post('/packs', {
      ...packBody,
      name: 'Spare 36 V pack',
      notes: 'blue tape',
    })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({
      ...packBody,
      name: 'Spare 36 V pack',
      // The pack's own label is its name, so the part drops into a rig's estimate as it is.
      label: 'Spare 36 V pack',
      notes: 'blue tape',
      version: 1,
      createdBy: { name: 'editor' },
    })
    expect(Date.parse(created.body.createdAt)).not.toBeNaN()
    expect(created.body.updatedAt).toBe(created.body.createdAt)

    const read = await editor.get(`/packs/${created.body.id}`).expect(200)
    expect(read.body).toEqual(created.body)
  })

  it.each([
    ['amplifiers', amplifierBody],
    ['speakers', speakersBody],
    ['accessories', accessoryBody],
  ])('stores %s with the engine fields it was given', async (collection, body) => {
    const created = await editor.post(`/${collection}`, { ...body, name: 'Second one' }).expect(201)
    expect(created.body).toMatchObject({ ...body, name: 'Second one', version: 1 })
  })

  it('refuses bad datasheet values with 400 naming each field, and writes nothing', async () => {
    const before = await packCount()
    const response = await editor
      .post('/packs', {
        ...packBody,
        seriesCells: 0,
        // Source: common practice, a Li-ion cell is full at 4.2 V; a 4.3 V cutoff is above it.
        cutoffCellV: 4.3,
      })
      .expect(400)
    expect(response.body.error.code).toBe('invalid-input')
    const paths = response.body.error.issues.map((issue: { path: string }) => issue.path)
    expect(paths).toContain('seriesCells')
    expect(await packCount()).toBe(before)

    const cutoff = await editor.post('/packs', { ...packBody, cutoffCellV: 4.3 }).expect(400)
    expect(cutoff.body.error.issues).toEqual([
      { path: 'cutoffCellV', message: expect.stringContaining('4.20 V') },
    ])
  })

  it('reports a missing name at `name` alone', async () => {
    const { name: _name, ...unnamed } = accessoryBody
    const response = await editor.post('/accessories', unnamed).expect(400)
    expect(response.body.error.issues).toEqual([{ path: 'name', message: 'Enter a name' }])
  })

  it('checks the accessory input range (min above max is refused at inputMinV)', async () => {
    const response = await editor
      .post('/accessories', { ...accessoryBody, inputMinV: 20, inputMaxV: 10 })
      .expect(400)
    expect(response.body.error.issues[0].path).toBe('inputMinV')
  })

  it('answers 413 to an oversized body and 400 to malformed JSON, writing nothing', async () => {
    const before = await packCount()
    await editor.post('/packs', { ...packBody, notes: 'x'.repeat(300 * 1024) }).expect(413)
    await request(fixture.testApp.app)
      .post(`/api/v1/teams/${fixture.placeholders.teamId}/packs`)
      .set('Cookie', fixture.cookies.editor)
      .set('Content-Type', 'application/json')
      .send('{"name": ')
      .expect(400)
    expect(await packCount()).toBe(before)
  })
})

describe('listing parts', () => {
  beforeEach(async () => {
    for (const name of ['alpha pack', 'Bravo pack', 'charlie pack', 'Delta pack']) {
      await editor.post('/packs', { ...packBody, name }).expect(201)
    }
  })

  it('pages with limit and offset and counts the whole list', async () => {
    const page = await editor.get('/packs?limit=2&offset=1&sort=name').expect(200)
    // The fixture's "Tool pack 36 V 5 Ah" sorts last; names compare without case.
    expect(page.body.total).toBe(5)
    expect(page.body.items.map((item: { name: string }) => item.name)).toEqual([
      'Bravo pack',
      'charlie pack',
    ])
  })

  it('sorts descending with a leading minus', async () => {
    const page = await editor.get('/packs?sort=-name&limit=2').expect(200)
    expect(page.body.items.map((item: { name: string }) => item.name)).toEqual([
      'Tool pack 36 V 5 Ah',
      'Delta pack',
    ])
  })

  it('searches names with q, without case, treating % and _ as plain characters', async () => {
    const found = await editor.get('/packs?q=CHAR').expect(200)
    expect(found.body).toMatchObject({ total: 1, items: [{ name: 'charlie pack' }] })
    const literal = await editor.get('/packs?q=%25').expect(200)
    expect(literal.body.total).toBe(0)
  })

  it('refuses an unknown sort field with 400 naming it', async () => {
    const response = await editor.get('/packs?sort=chemistry').expect(400)
    expect(response.body.error.issues).toEqual([
      { path: 'sort', message: expect.stringContaining('"chemistry" is not a sort field') },
    ])
  })

  it('refuses a limit above the maximum', async () => {
    const response = await editor.get('/packs?limit=5000').expect(400)
    expect(response.body.error.issues[0].path).toBe('limit')
  })
})

describe('updating parts', () => {
  it('saves with the current version and refuses a stale one with 409, writing nothing', async () => {
    const id = fixture.placeholders.packId
    const saved = await editor
      .put(`/packs/${id}`, { ...packBody, healthPct: 90, version: 1 })
      .expect(200)
    expect(saved.body).toMatchObject({ version: 2, healthPct: 90 })

    const stale = await editor
      .put(`/packs/${id}`, { ...packBody, name: 'Overwritten', version: 1 })
      .expect(409)
    expect(stale.body.error.code).toBe('stale-version')
    expect(stale.body.error.message).toContain('version 2')
    const after = await editor.get(`/packs/${id}`).expect(200)
    expect(after.body).toMatchObject({ name: packBody.name, version: 2, healthPct: 90 })
  })

  it('needs the version in the body', async () => {
    const response = await editor.put(`/packs/${fixture.placeholders.packId}`, packBody).expect(400)
    expect(response.body.error.issues).toEqual([{ path: 'version', message: expect.any(String) }])
  })

  it('does not let an editor of one team reach a part of another team', async () => {
    const otherTeam = await request(fixture.testApp.app)
      .get('/api/v1/teams')
      .set('Cookie', fixture.cookies['other-team-admin'])
      .expect(200)
    const otherTeamId = String(otherTeam.body.teams[0].id)
    const outsider = teamApi(fixture.testApp.app, otherTeamId, fixture.cookies['other-team-admin'])
    const theirs = await outsider.post('/packs', { ...packBody, name: 'Theirs' }).expect(201)
    // The editor's own team path does not lead to the other team's pack.
    await editor.get(`/packs/${theirs.body.id}`).expect(404)
    await editor.put(`/packs/${theirs.body.id}`, { ...packBody, version: 1 }).expect(404)
    await editor.delete(`/packs/${theirs.body.id}`).expect(404)
    const list = await editor.get('/packs').expect(200)
    expect(list.body.items.map((item: { name: string }) => item.name)).not.toContain('Theirs')
  })
})

describe('duplicating and deleting parts', () => {
  it('duplicates a part as a new item named "(copy)" at version 1', async () => {
    const copy = await editor
      .post(`/speakers/${fixture.placeholders.speakersId}/duplicate`)
      .expect(201)
    expect(copy.body).toMatchObject({
      ...speakersBody,
      name: `${speakersBody.name} (copy)`,
      version: 1,
    })
    expect(copy.body.id).not.toBe(Number(fixture.placeholders.speakersId))
  })

  it('deletes a part no rig uses', async () => {
    const spare = await editor.post('/amplifiers', { ...amplifierBody, name: 'Spare' }).expect(201)
    await editor.delete(`/amplifiers/${spare.body.id}`).expect(204)
    await editor.get(`/amplifiers/${spare.body.id}`).expect(404)
  })

  it("refuses an editor's delete of a part in use with 403 naming the rig", async () => {
    // Source: docs/api.md: DELETE needs an admin for parts in use (403 not allowed).
    const response = await editor.delete(`/packs/${fixture.placeholders.packId}`).expect(403)
    expect(response.body.error.code).toBe('part-in-use')
    expect(response.body.error.message).toContain('"Market stage column"')
    await editor.get(`/packs/${fixture.placeholders.packId}`).expect(200)
  })

  it("detaches a part in use on an admin's delete; the rig keeps its copied values", async () => {
    const rigPath = `/rigs/${fixture.placeholders.rigId}`
    const before = await admin.get(rigPath).expect(200)
    const response = await admin.delete(`/packs/${fixture.placeholders.packId}`).expect(200)
    expect(response.body).toEqual({
      detachedRigs: [{ id: Number(fixture.placeholders.rigId), name: 'Market stage column' }],
    })
    await admin.get(`/packs/${fixture.placeholders.packId}`).expect(404)
    const after = await admin.get(rigPath).expect(200)
    expect(after.body.packId).toBeNull()
    expect(after.body.spec).toEqual(before.body.spec)
    // Anyone still holding the old version must reload rather than re-attach a deleted pack.
    expect(after.body.version).toBe(before.body.version + 1)
  })

  it("detaches an accessory through the link table on an admin's delete", async () => {
    const { db } = fixture.testApp.database
    await editor.delete(`/accessories/${fixture.placeholders.accessoryId}`).expect(403)
    await admin.delete(`/accessories/${fixture.placeholders.accessoryId}`).expect(200)
    const rig = await admin.get(`/rigs/${fixture.placeholders.rigId}`).expect(200)
    expect(rig.body.accessoryIds).toEqual([])
    expect(rig.body.spec.accessories).toHaveLength(1)
    expect(await db.$count(rigAccessories)).toBe(0)
  })

  it('is guarded by the database too: a used pack cannot be deleted behind the API', () => {
    const { db } = fixture.testApp.database
    const packId = Number(fixture.placeholders.packId)
    expect(() => db.delete(packs).where(eq(packs.id, packId)).run()).toThrow(/FOREIGN KEY/)
    expect(db.select().from(rigs).get()?.packId).toBe(packId)
  })
})
