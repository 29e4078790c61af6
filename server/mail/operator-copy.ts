import { chmodSync, mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'

// Ours: weeks of a crew's mail, yet a flood of sign-ups cannot fill the disk; oldest go first.
export const keptMailFiles = 2000

export interface OperatorCopyOptions {
  /** Folder for the `.eml` files, created owner-only (0700). */
  mailDir: string
  /** Where the console line goes (the server's own standard output). */
  print: (text: string) => void
}

export interface CaughtMail {
  id: string
  to: string
  subject: string
  text: string
  raw: string
  receivedAt: Date
}

/**
 * The operator's copy of every message the built-in catcher holds: an `.eml` file (the message as
 * it came over SMTP, so any mail program opens it) readable by the server's user alone, and the
 * message on the console. The console is the operator's own: with no mail server, it is where
 * they find a link to hand to someone who asked for one.
 */
export function createOperatorCopy(options: OperatorCopyOptions): (mail: CaughtMail) => string {
  let folderReady = false
  return (mail) => {
    if (!folderReady) {
      mkdirSync(options.mailDir, { recursive: true, mode: 0o700 })
      // mkdir's mode passes through the umask and leaves an existing folder as it was.
      chmodSync(options.mailDir, 0o700)
      folderReady = true
    }
    const stamp = mail.receivedAt.toISOString().replaceAll(':', '-')
    const file = join(options.mailDir, `${stamp}-${mail.id}.eml`)
    writeFileSync(file, mail.raw, { mode: 0o600, flag: 'wx' })
    // Names start with the time, so sorted names are oldest first.
    const kept = readdirSync(options.mailDir)
      .filter((name) => name.endsWith('.eml'))
      .sort()
    for (const name of kept.slice(0, Math.max(0, kept.length - keptMailFiles))) {
      rmSync(join(options.mailDir, name), { force: true })
    }
    options.print(
      [
        `mail to ${mail.to}: ${JSON.stringify(mail.subject)} (${file})`,
        ...mail.text.split('\n').map((line) => `  | ${line}`),
      ].join('\n'),
    )
    return file
  }
}
