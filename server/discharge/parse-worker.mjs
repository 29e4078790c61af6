// The entry of a log-parser thread (see parse-pool.ts). A worker thread starts without the
// TypeScript loader its parent runs under (`node --import tsx`, or vitest), so the parser is
// loaded through tsx's own scoped import, which works under both.
import { tsImport } from 'tsx/esm/api'

const { analyseLogTask } = await tsImport('./parse-task.ts', import.meta.url)

export default analyseLogTask
