import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { dischargeLogs, packs } from '../../server/db/schema-resources'
import { modelConstantCurrentDischarge } from '../../shared/engine/discharge-model'
import {
  clockOf,
  constantCurrentSamples,
  csvOf,
  plainCells,
  plainHeader,
} from '../helpers/discharge-logs'
import { planBody } from '../helpers/plan-fixture'
import { packBody, teamApi } from '../helpers/resource-fixture'
import { createTeamFixture, type SignedInActor, type TeamFixture } from '../helpers/team-fixture'

// Discharge logs of a saved pack: /api/v1/teams/:teamId/packs/:packId/discharge-logs.
// The fixture's pack is 10 Li-ion cells in series, 2 in parallel, 2.5 Ah cells, cutoff 3 V per
// cell: the log is read down to 10 × 3 = 30 V against a rated 2 × 2.5 = 5 Ah.

let fixture: TeamFixture
let teamId: string
let packId: string
beforeEach(async () => {
  fixture = await createTeamFixture()
  teamId = fixture.placeholders.teamId!
  packId = fixture.placeholders.packId!
  // The team fixture seeds one log for the authorization matrix; these tests count from none.
  fixture.testApp.database.db.delete(dischargeLogs).run()
})
afterEach(() => fixture.testApp.close())

const logsPath = () => `/api/v1/teams/${teamId}/packs/${packId}/discharge-logs`

function upload(
  body: string | Buffer,
  options: { actor?: SignedInActor; fileName?: string; path?: string } = {},
) {
  return request(fixture.testApp.app)
    .post(options.path ?? logsPath())
    .set('Cookie', fixture.cookies[options.actor ?? 'editor'])
    .attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body), options.fileName ?? 'run.csv')
}

const storedLogCount = () => fixture.testApp.database.db.$count(dischargeLogs)

// 2 A for 2 h while the pack falls linearly from 41 V to exactly its 30 V cutoff.
const twoAmpsTwoHours = constantCurrentSamples({
  currentA: 2,
  hours: 2,
  startV: 41,
  endV: 30,
  stepS: 60,
})

describe('uploading a discharge log', () => {
  it('gives Ah = I × t exactly for a constant current, and health against a new pack', async () => {
    const response = await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells))
    expect(response.status, JSON.stringify(response.body)).toBe(201)
    // Source: definition of the ampere-hour: 2 A × 2 h = 4 Ah; 4 of 5 Ah rated is 80 %.
    expect(response.body.deliveredAh).toBeCloseTo(4, 9)
    expect(response.body.labelHealthPct).toBeCloseTo(80, 7)
    // A new pack loses some charge at 2 A too (I·R sag reaches the cutoff early), so the
    // health measured against it is above the label ratio, and the model with it gives 4 Ah back.
    expect(response.body.calibration.newPackAh).toBeLessThan(5)
    expect(response.body.calibration.currentA).toBeCloseTo(2, 9)
    expect(response.body.healthPct).toBeGreaterThan(80)
    expect(response.body.healthPct).toBeCloseTo((100 * 4) / response.body.calibration.newPackAh, 6)
    expect(Math.abs(response.body.calibration.calibratedAh - 4)).toBeLessThan(0.03 * 4)
    // Source: trapezoid rule, exact for a linear voltage: Wh = I × mean V × t = 2 × 35.5 × 2.
    expect(response.body.deliveredWh).toBeCloseTo(142, 7)
    expect(response.body).toMatchObject({
      reachedCutoff: true,
      note: null,
      cutoffV: 30,
      ratedAh: 5,
      sampleCount: 121,
      durationS: 7200,
      fileName: 'run.csv',
      uploadedBy: { name: 'editor' },
      acceptedAt: null,
    })
    expect(response.body.averageCurrentA).toBeCloseTo(2, 9)
    expect(response.body.resistanceOhm).toBeUndefined()
    expect(response.body.points).toHaveLength(121)
    expect(typeof response.body.id).toBe('number')

    const editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.viewer)
    const list = await editor.get(`/packs/${packId}/discharge-logs`).expect(200)
    expect(list.body.total).toBe(1)
    expect(list.body.items[0]).not.toHaveProperty('points')
    expect(list.body.items[0].deliveredAh).toBeCloseTo(4, 9)
    const one = await editor.get(`/packs/${packId}/discharge-logs/${response.body.id}`).expect(200)
    expect(one.body).toEqual(response.body)
  })

  it.each([
    [
      'bracketed units, semicolons, mV and mA',
      'Time (s);Voltage (mV);Current (mA)',
      (s: (typeof twoAmpsTwoHours)[number]) => [s.timeS, s.voltageV * 1000, s.currentA * 1000],
      ';',
    ],
    [
      'minutes and a negative (discharge-signed) current',
      'TIME_MIN,Voltage_V,Current_A',
      (s: (typeof twoAmpsTwoHours)[number]) => [s.timeS / 60, s.voltageV, -s.currentA],
      ',',
    ],
    [
      'power instead of current (I = P / V)',
      'time_s,voltage_v,power_w',
      (s: (typeof twoAmpsTwoHours)[number]) => [s.timeS, s.voltageV, s.voltageV * s.currentA],
      ',',
    ],
    [
      'a running mAh count (I = ΔQ / Δt)',
      'time_s,voltage_v,capacity_mah',
      (s: (typeof twoAmpsTwoHours)[number]) => [s.timeS, s.voltageV, (s.currentA * s.timeS) / 3.6],
      ',',
    ],
    [
      'hh:mm:ss times in a plain time column',
      'time,voltage_v,current_a',
      (s: (typeof twoAmpsTwoHours)[number]) => [clockOf(s.timeS), s.voltageV, s.currentA],
      ',',
    ],
  ])('reads %s to the same 4 Ah', async (_label, header, cells, delimiter) => {
    const response = await upload(csvOf(twoAmpsTwoHours, header, cells, delimiter))
    expect(response.status, JSON.stringify(response.body)).toBe(201)
    // Source: definition of the ampere-hour (2 A × 2 h); the units are SI prefixes and P = V·I.
    expect(response.body.deliveredAh).toBeCloseTo(4, 6)
    expect(response.body.reachedCutoff).toBe(true)
  })

  it('stops at the interpolated cutoff crossing', async () => {
    // 2 A while the voltage falls linearly from 41 V to 19 V in 2 h: 30 V is passed halfway.
    // Source: linear interpolation of the crossing; Ah = I × t = 2 A × 1 h.
    const log = constantCurrentSamples({ currentA: 2, hours: 2, startV: 41, endV: 19, stepS: 90 })
    const response = await upload(csvOf(log, plainHeader, plainCells)).expect(201)
    expect(response.body.deliveredAh).toBeCloseTo(2, 9)
    expect(response.body.durationS).toBeCloseTo(3600, 6)
    expect(response.body.endVoltageV).toBe(30)
  })

  it('says so when the log never reaches the cutoff, and gives the figures as a lower bound', async () => {
    const log = constantCurrentSamples({ currentA: 2, hours: 1, startV: 41, endV: 36, stepS: 60 })
    const response = await upload(csvOf(log, plainHeader, plainCells)).expect(201)
    // Source: definition of the ampere-hour: 2 A × 1 h.
    expect(response.body.deliveredAh).toBeCloseTo(2, 9)
    expect(response.body.reachedCutoff).toBe(false)
    expect(response.body.note).toMatch(/ends at 36\.00 V, above the pack's cutoff of 30\.00 V/)
    expect(response.body.note).toMatch(/lower bound/)
  })

  it('says so when the log starts below the cutoff (a log of another pack)', async () => {
    // A 4-cell log (16.8 V full) read against this 10-cell pack's 30 V cutoff: nothing counts.
    const log = constantCurrentSamples({ currentA: 2, hours: 1, startV: 16.4, endV: 13, stepS: 60 })
    const response = await upload(csvOf(log, plainHeader, plainCells)).expect(201)
    expect(response.body.deliveredAh).toBe(0)
    expect(response.body.note).toMatch(/starts at or below the pack's cutoff of 30\.00 V/)
  })

  it('estimates internal resistance from the load steps in the log', async () => {
    // Thevenin model V = OCV − I·R (any circuit theory text): 0.11 Ω, the load stepping 1 A ↔ 3 A
    // every minute while the open-circuit voltage falls slowly.
    const resistanceOhm = 0.11
    const rows = ['time_s,voltage_v,current_a']
    for (let timeS = 0; timeS <= 1200; timeS += 5) {
      const currentA = Math.floor(timeS / 60) % 2 === 0 ? 1 : 3
      rows.push(
        `${timeS},${(39 - timeS * 0.001 - currentA * resistanceOhm).toFixed(4)},${currentA}`,
      )
    }
    const response = await upload(rows.join('\n')).expect(201)
    expect(response.body.resistanceOhm).toBeCloseTo(resistanceOhm, 3)
    expect(response.body.resistanceSteps).toBe(20)
  })
})

describe('refusing what is not a discharge log, storing nothing', () => {
  it('refuses binary junk with 415', async () => {
    const junk = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00, 0xff, 0x00, 0x13])
    const response = await upload(junk, { fileName: 'run.xlsx' })
    expect(response.status).toBe(415)
    expect(response.body.error).toMatchObject({ code: 'not-csv' })
    expect(response.body.error.message).toMatch(/not a text CSV/)
    expect(await storedLogCount()).toBe(0)
  })

  it('refuses an empty file with 400', async () => {
    const response = await upload('')
    expect(response.status).toBe(400)
    expect(response.body.error.message).toMatch(/empty/)
    expect(await storedLogCount()).toBe(0)
  })

  it('refuses a 12 MB file with 413 and keeps answering the next request', async () => {
    const row = '1234,40.000,2.000\n'
    const big = Buffer.from(
      plainHeader + '\n' + row.repeat(Math.ceil((12 * 1024 * 1024) / row.length)),
    )
    expect(big.length).toBeGreaterThan(12 * 1024 * 1024)
    const response = await upload(big)
    expect(response.status).toBe(413)
    expect(response.body.error).toMatchObject({ code: 'too-large' })
    expect(response.body.error.message).toMatch(/larger than 5 MB/)
    expect(await storedLogCount()).toBe(0)
    // The server is still there and answers the next upload normally.
    await request(fixture.testApp.app).get('/api/health').expect(200)
    await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells)).expect(201)
  })

  it('never evaluates formula-looking cells: 400 naming the row and column', async () => {
    const text = 'time_s,voltage_v,current_a\n0,40,2\n60,=HYPERLINK("x"),2\n120,39.8,2\n'
    const response = await upload(text)
    expect(response.status).toBe(400)
    expect(response.body.error.message).toMatch(/Row 3, column voltage_v: "=HYPERLINK/)
    expect(await storedLogCount()).toBe(0)
  })

  it('names the missing columns', async () => {
    const response = await upload('time_s,temperature_c\n0,20\n60,21\n')
    expect(response.status).toBe(400)
    expect(response.body.error.message).toMatch(/no column for voltage.*current/)
  })

  it('asks for the file when the form has none, or has it under another name', async () => {
    const cookie = fixture.cookies.editor
    const json = await request(fixture.testApp.app)
      .post(logsPath())
      .set('Cookie', cookie)
      .send({ file: 'time_s,voltage_v,current_a' })
    expect(json.status).toBe(400)
    expect(json.body.error.issues).toEqual([{ path: 'file', message: 'Choose a CSV file' }])
    const wrongField = await request(fixture.testApp.app)
      .post(logsPath())
      .set('Cookie', cookie)
      .attach('log', Buffer.from('time_s,voltage_v,current_a\n0,40,2\n1,40,2\n'), 'run.csv')
    expect(wrongField.status).toBe(400)
    expect(wrongField.body.error.message).toMatch(/form field "file"/)
    expect(await storedLogCount()).toBe(0)
  })
})

describe('who may upload and read logs', () => {
  const text = () => csvOf(twoAmpsTwoHours, plainHeader, plainCells)

  it('refuses a viewer with 403 and stores nothing', async () => {
    const response = await upload(text(), { actor: 'viewer' })
    expect(response.status).toBe(403)
    expect(await storedLogCount()).toBe(0)
  })

  it('answers 404 to another team, and for a log asked for under another pack', async () => {
    expect((await upload(text(), { actor: 'other-team-admin' })).status).toBe(404)
    const created = await upload(text()).expect(201)
    const other = await request(fixture.testApp.app)
      .get(`${logsPath()}/${created.body.id}`)
      .set('Cookie', fixture.cookies['other-team-admin'])
    expect(other.status).toBe(404)
    const editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
    const secondPack = await editor.post('/packs', { ...packBody, name: 'Second pack' }).expect(201)
    const elsewhere = await editor.get(
      `/packs/${secondPack.body.id}/discharge-logs/${created.body.id}`,
    )
    expect(elsewhere.status).toBe(404)
    expect(elsewhere.body.error.message).toBe('No such discharge log for this pack.')
  })
})

describe('accepting a log as the pack health figure', () => {
  const editorApi = () => teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
  const readPack = async () => (await editorApi().get(`/packs/${packId}`).expect(200)).body

  it('sets the pack health from the log and bumps the pack version, in one write', async () => {
    const created = await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells)).expect(201)
    const before = await readPack()
    expect(before.version).toBe(1)
    expect(before.healthPct).toBeUndefined()
    const accepted = await editorApi()
      .post(`/packs/${packId}/discharge-logs/${created.body.id}/accept`, { version: 1 })
      .expect(200)
    // The health figure is the log's, to one decimal as the pack form takes it.
    const healthPct = Math.round(created.body.healthPct * 10) / 10
    expect(accepted.body.pack).toMatchObject({ id: Number(packId), version: 2, healthPct })
    expect(accepted.body.log.acceptedAt).not.toBeNull()
    const after = await readPack()
    expect(after).toMatchObject({ version: 2, healthPct, seriesCells: 10, cellCapacityAh: 2.5 })
    // Source: definition of the ampere-hour: the log gave 2 A × 2 h = 4 Ah; the pack as saved
    // now must give that back at the log's current, within 3 %.
    expect(Math.abs(modelConstantCurrentDischarge(after, 2).deliveredAh - 4)).toBeLessThan(0.12)
    expect(after.updatedBy).toMatchObject({ name: 'editor' })
  })

  it('carries the health figure into the rigs using the pack, and works out their plans again', async () => {
    // Source: definition of state of health: a health below 100 % is less charge than rated, so the
    // rig's runtime falls (the engine's run is energy-limited here, to within its step).
    const rigPath = `/rigs/${fixture.placeholders.rigId}`
    const rigBefore = (await editorApi().get(rigPath).expect(200)).body
    const plan = await editorApi()
      .post('/plans', {
        ...planBody,
        rigId: Number(fixture.placeholders.rigId),
        // One pack for a day it cannot last: the plan's figure is the pack's runtime.
        packCount: 1,
        schedule: [{ label: 'All day', minutes: 1440, state: 'on', peakBelowClipDb: 0 }],
      })
      .expect(201)
    const planPath = `/plans/${plan.body.id}`
    const planBefore = plan.body
    expect(rigBefore.packId).toBe(Number(packId))
    const created = await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells)).expect(201)
    const accepted = await editorApi()
      .post(`/packs/${packId}/discharge-logs/${created.body.id}/accept`, { version: 1 })
      .expect(200)
    expect(accepted.body.updatedRigs).toEqual([
      { id: Number(fixture.placeholders.rigId), name: rigBefore.name },
    ])
    const rigAfter = (await editorApi().get(rigPath).expect(200)).body
    expect(rigAfter.version).toBe(rigBefore.version + 1)
    expect(rigAfter.spec.pack.healthPct).toBe(Math.round(created.body.healthPct * 10) / 10)
    expect(rigAfter.summary.runtimeHours).toBeLessThan(rigBefore.summary.runtimeHours)
    const planAfter = (await editorApi().get(planPath).expect(200)).body
    expect(planBefore.summary.lasts).toBe(false)
    expect(planAfter.summary.runtimeHours).toBeLessThan(planBefore.summary.runtimeHours)
  })

  it('refuses a stale pack version with 409 and changes nothing', async () => {
    const created = await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells)).expect(201)
    await editorApi()
      .put(`/packs/${packId}`, { ...packBody, notes: 'relabelled', version: 1 })
      .expect(200)
    const stale = await editorApi().post(
      `/packs/${packId}/discharge-logs/${created.body.id}/accept`,
      { version: 1 },
    )
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale-version')
    const pack = await readPack()
    expect(pack).toMatchObject({ version: 2 })
    expect(pack.healthPct).toBeUndefined()
    const log = await editorApi().get(`/packs/${packId}/discharge-logs/${created.body.id}`)
    expect(log.body.acceptedAt).toBeNull()
  })

  it('refuses a log that stops above the cutoff', async () => {
    const log = constantCurrentSamples({ currentA: 2, hours: 1, startV: 41, endV: 36, stepS: 60 })
    const created = await upload(csvOf(log, plainHeader, plainCells)).expect(201)
    const response = await editorApi().post(
      `/packs/${packId}/discharge-logs/${created.body.id}/accept`,
    )
    expect(response.status).toBe(400)
    expect(response.body.error.code).toBe('log-incomplete')
    expect((await readPack()).version).toBe(1)
  })

  it('refuses a log that a new pack of this spec could not have given', async () => {
    // Ohm's law: 10 cells of 2 Ω in series, 2 in parallel, are 10 Ω; 2 A sags 20 V from 42 V,
    // below the 30 V cutoff at once, so no health can be measured against such a pack.
    await editorApi()
      .put(`/packs/${packId}`, { ...packBody, cellResistanceOhm: 2, version: 1 })
      .expect(200)
    const created = await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells)).expect(201)
    expect(created.body.calibration).toBeNull()
    expect(created.body.healthPct).toBeCloseTo(80, 7)
    const response = await editorApi().post(
      `/packs/${packId}/discharge-logs/${created.body.id}/accept`,
    )
    expect(response.status).toBe(400)
    expect(response.body.error.code).toBe('log-not-comparable')
    expect(await readPack()).toMatchObject({ version: 2 })
  })

  it('refuses a health figure beyond what a pack can be saved with', async () => {
    // 4 A for 2 h is 8 Ah of a rated 5 Ah: 160 %, above the pack schema's 120 % ceiling (and
    // more still against a new pack at 4 A).
    const log = constantCurrentSamples({ currentA: 4, hours: 2, startV: 41, endV: 30, stepS: 60 })
    const created = await upload(csvOf(log, plainHeader, plainCells)).expect(201)
    expect(created.body.labelHealthPct).toBeCloseTo(160, 6)
    expect(created.body.healthPct).toBeGreaterThan(160)
    const response = await editorApi().post(
      `/packs/${packId}/discharge-logs/${created.body.id}/accept`,
    )
    expect(response.status).toBe(400)
    expect(response.body.error.issues).toEqual([
      { path: 'healthPct', message: 'Pack health must be more than 0 and at most 120 %' },
    ])
    expect((await readPack()).version).toBe(1)
  })

  it('deletes a log; the accepted health figure stays with the pack', async () => {
    const created = await upload(csvOf(twoAmpsTwoHours, plainHeader, plainCells)).expect(201)
    const path = `/packs/${packId}/discharge-logs/${created.body.id}`
    await editorApi().post(`${path}/accept`).expect(200)
    await editorApi().delete(path).expect(204)
    await editorApi().get(path).expect(404)
    expect(await storedLogCount()).toBe(0)
    expect((await readPack()).healthPct).toBe(Math.round(created.body.healthPct * 10) / 10)
    expect(await fixture.testApp.database.db.$count(packs)).toBe(1)
  })
})
