import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { createServer } from 'node:net'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'

const projectRoot = fileURLToPath(new URL('../..', import.meta.url))

export interface RunningServer {
  url: string
  dataDir: string
  output: () => string
  stop: () => Promise<void>
}

function freeLoopbackPort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer()
    probe.once('error', reject)
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address()
      const port = typeof address === 'object' && address ? address.port : 0
      probe.close(() => resolve(port))
    })
  })
}

/**
 * Starts the real server (the same command as `npm start`) on the built client, on a free
 * loopback port with a fresh data folder, and waits until /api/health answers.
 */
export async function startServer(extraEnv: Record<string, string> = {}): Promise<RunningServer> {
  const port = await freeLoopbackPort()
  const dataDir = mkdtempSync(join(tmpdir(), 'loudhour-e2e-'))
  const url = `http://127.0.0.1:${port}`
  let output = ''
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      PUBLIC_URL: url,
      LOUDHOUR_DATA_DIR: dataDir,
      ...extraEnv,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()))
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()))

  const deadline = Date.now() + 60_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`Server exited early:\n${output}`)
    try {
      const response = await fetch(`${url}/api/health`)
      if (response.ok) break
    } catch {
      // Not listening yet.
    }
    if (Date.now() > deadline) throw new Error(`Server did not start within 60 s:\n${output}`)
    await new Promise((resolve) => setTimeout(resolve, 200))
  }

  return {
    url,
    dataDir,
    output: () => output,
    stop: async () => {
      if (child.exitCode === null) {
        const exited = new Promise((resolve) => child.once('exit', resolve))
        child.kill('SIGTERM')
        await exited
      }
      rmSync(dataDir, { recursive: true, force: true })
    },
  }
}
