import { randomBytes } from 'node:crypto'
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { ownerOnlyFileMode, tightenIfPresent } from './owner-only'

const secretFileName = 'session-secret'
// jose HS256 keys shorter than the hash output weaken the MAC (RFC 7518 §3.2 asks for ≥ 256 bits).
export const minimumSecretBytes = 32

/**
 * The session-signing secret: SESSION_SECRET when set, otherwise one generated on first run and
 * kept in the data folder so that sessions survive a restart.
 */
export function resolveSessionSecret(dataDir: string, configured: string | undefined): string {
  if (configured) return assertLongEnough(configured, 'SESSION_SECRET')
  const file = join(dataDir, secretFileName)
  if (existsSync(file)) {
    tightenIfPresent(file)
    return assertLongEnough(readFileSync(file, 'utf8').trim(), file)
  }
  const secret = randomBytes(48).toString('base64url')
  writeFileSync(file, secret + '\n', { mode: ownerOnlyFileMode })
  return secret
}

function assertLongEnough(secret: string, origin: string): string {
  if (Buffer.byteLength(secret, 'utf8') < minimumSecretBytes) {
    throw new Error(`${origin} must be at least ${minimumSecretBytes} bytes long`)
  }
  return secret
}
