import argon2 from 'argon2'

// argon2id at the OWASP Password Storage Cheat Sheet's first listed minimum: m = 19 MiB, t = 2, p = 1.
export const passwordHashOptions = {
  type: argon2.argon2id,
  memoryCost: 19_456,
  timeCost: 2,
  parallelism: 1,
} as const

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, passwordHashOptions)
}

// A hash of a random string, made once: verifying against it for an unknown address costs the same
// as for a real account, so the answer's timing does not tell which addresses exist.
let dummyHash: Promise<string> | undefined
function getDummyHash(): Promise<string> {
  dummyHash ??= hashPassword(crypto.randomUUID())
  return dummyHash
}

/** Checks a password against a stored hash, or against the dummy hash when there is no account. */
export async function verifyPassword(
  storedHash: string | undefined,
  password: string,
): Promise<boolean> {
  if (storedHash === undefined) {
    await argon2.verify(await getDummyHash(), password)
    return false
  }
  try {
    return await argon2.verify(storedHash, password)
  } catch {
    // A malformed stored hash is a failed check, not a server error the caller could tell apart.
    return false
  }
}

/** Warms the dummy hash at start-up so the first unknown-address sign-in is not the slow one. */
export async function preparePasswordChecks(): Promise<void> {
  await getDummyHash()
}
