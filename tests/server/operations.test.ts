import { chmodSync, mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { openDatabase } from '../../server/db/client'
import { runMigrations } from '../../server/db/migrate'
import { parseEnv } from '../../server/env'
import { ownerOnlyDir } from '../../server/owner-only'
import { resolveSessionSecret } from '../../server/secret'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'

// The permission bits of a file or folder (POSIX st_mode & 0777).
const modeOf = (path: string) => statSync(path).mode & 0o777

describe('TRUST_PROXY', () => {
  // The values are Express's `trust proxy` setting (expressjs.com, "Express behind proxies").
  it('trusts no proxy when unset or false', () => {
    expect(parseEnv({}).TRUST_PROXY).toBe(false)
    expect(parseEnv({ TRUST_PROXY: 'false' }).TRUST_PROXY).toBe(false)
  })

  it('takes a hop count, true, or a list of addresses, subnets and range names', () => {
    expect(parseEnv({ TRUST_PROXY: '1' }).TRUST_PROXY).toBe(1)
    expect(parseEnv({ TRUST_PROXY: 'true' }).TRUST_PROXY).toBe(true)
    expect(
      parseEnv({ TRUST_PROXY: 'loopback, 10.0.0.0/8, fd00::/8, 192.0.2.1' }).TRUST_PROXY,
    ).toEqual(['loopback', '10.0.0.0/8', 'fd00::/8', '192.0.2.1'])
  })

  it('names the setting and the entry it cannot read', () => {
    expect(() => parseEnv({ TRUST_PROXY: 'loopback, my-proxy' })).toThrow(
      /TRUST_PROXY.*not understood: my-proxy/,
    )
    expect(() => parseEnv({ TRUST_PROXY: '10.0.0.0/8/1' })).toThrow(/TRUST_PROXY/)
  })

  it('keeps the log quiet in tests and at info otherwise, unless LOG_LEVEL says', () => {
    expect(parseEnv({ NODE_ENV: 'test' }).LOG_LEVEL).toBe('silent')
    expect(parseEnv({}).LOG_LEVEL).toBe('info')
    expect(parseEnv({ LOG_LEVEL: 'warn' }).LOG_LEVEL).toBe('warn')
    expect(() => parseEnv({ LOG_LEVEL: 'loud' })).toThrow(/LOG_LEVEL must be one of/)
  })
})

describe('answers no cache may keep', () => {
  let fixture: TeamFixture
  beforeEach(async () => {
    fixture = await createTeamFixture()
  })
  afterEach(() => fixture.testApp.close())

  // RFC 9111 §5.2.2.5: `no-store` tells every cache not to keep any part of the answer.
  it('sends Cache-Control: no-store with signed-in answers and the sign-in answer', async () => {
    const { app } = fixture.testApp
    const { teamId } = fixture.placeholders
    for (const path of ['/api/v1/auth/me', `/api/v1/teams/${teamId}/plans`, '/api/v1/teams']) {
      const answer = await request(app).get(path).set('Cookie', fixture.cookies.viewer).expect(200)
      expect(answer.headers['cache-control'], path).toBe('no-store')
    }
    const signIn = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: fixture.emails.viewer, password: 'amber kettle wanders north 41' })
      .expect(200)
    expect(signIn.headers['cache-control']).toBe('no-store')
    const refused = await request(app).get('/api/v1/auth/me').expect(401)
    expect(refused.headers['cache-control']).toBe('no-store')
  })

  it('lets the built-in library, which anyone may read, be cached', async () => {
    const answer = await request(fixture.testApp.app).get('/api/v1/library/packs').expect(200)
    expect(answer.headers['cache-control']).toBe('public, max-age=3600')
  })
})

describe('data files readable by their owner only', () => {
  let dataDir: string
  let previousUmask: number
  beforeEach(() => {
    dataDir = mkdtempSync(join(tmpdir(), 'loudhour-modes-'))
    // A permissive umask, as on many servers: the modes must not depend on it.
    previousUmask = process.umask(0o022)
  })
  afterEach(() => {
    process.umask(previousUmask)
    rmSync(dataDir, { recursive: true, force: true })
  })

  // 0600 files and a 0700 folder: read and write for the owner, nothing for group and others
  // (POSIX permission bits; common practice for a service's private data).
  it('creates the database and its -wal and -shm files 0600', () => {
    const file = join(dataDir, 'loudhour.db')
    const database = openDatabase(file)
    runMigrations(database)
    for (const path of [file, `${file}-wal`, `${file}-shm`]) expect(modeOf(path), path).toBe(0o600)
    database.sqlite.close()
  })

  it('tightens a database an older version left readable to all', () => {
    const file = join(dataDir, 'loudhour.db')
    openDatabase(file).sqlite.close()
    for (const path of [file, `${file}-wal`, `${file}-shm`]) {
      writeFileSync(path, '', { flag: 'a' })
      chmodSync(path, 0o644)
    }
    const database = openDatabase(file)
    for (const path of [file, `${file}-wal`, `${file}-shm`]) expect(modeOf(path), path).toBe(0o600)
    database.sqlite.close()
  })

  it('writes the session secret 0600 and tightens an old one', () => {
    resolveSessionSecret(dataDir, undefined)
    const secretFile = join(dataDir, 'session-secret')
    expect(modeOf(secretFile)).toBe(0o600)
    chmodSync(secretFile, 0o644)
    resolveSessionSecret(dataDir, undefined)
    expect(modeOf(secretFile)).toBe(0o600)
  })

  it('makes the data folder 0700, new or already there', () => {
    const fresh = join(dataDir, 'deep', 'data')
    ownerOnlyDir(fresh)
    expect(modeOf(fresh)).toBe(0o700)
    const old = join(dataDir, 'old')
    mkdirSync(old, { mode: 0o755 })
    ownerOnlyDir(old)
    expect(modeOf(old)).toBe(0o700)
  })
})
