import { dottedPath } from '@/display/messagesByPath'
import { estimateRequestSchema, type EstimateRequest } from '@shared/schemas/estimate'

// Loudhour's own rig file: a small envelope that names itself, so a foreign JSON file is told
// apart from a damaged one, and a version for when the rig's shape changes.
export const rigFileFormat = 'loudhour-rig'
export const rigFileVersion = 1
// Far above any real rig (a few kilobytes); refuses a wrong file before reading it whole.
export const rigFileMaxBytes = 512 * 1024

export interface RigFile {
  format: typeof rigFileFormat
  version: typeof rigFileVersion
  name: string
  exportedAt: string
  rig: EstimateRequest
}

export type RigFileReading =
  { ok: true; rig: EstimateRequest; name: string } | { ok: false; message: string }

export function rigFileText(rig: EstimateRequest, name: string, now = new Date()): string {
  const file: RigFile = {
    format: rigFileFormat,
    version: rigFileVersion,
    name,
    exportedAt: now.toISOString(),
    rig,
  }
  return JSON.stringify(file, null, 2) + '\n'
}

/** A file name that is safe on every system: "market-stage-column.loudhour-rig.json". */
export function rigFileName(name: string): string {
  const slug = name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
  return `${slug || 'rig'}.${rigFileFormat}.json`
}

function failure(message: string): RigFileReading {
  return { ok: false, message }
}

/** Reads a rig file's text; anything but a valid Loudhour rig gets a message and no rig. */
export function readRigFile(text: string): RigFileReading {
  let content: unknown
  try {
    content = JSON.parse(text)
  } catch {
    return failure('This file is not a Loudhour rig file: it is not readable JSON.')
  }
  if (typeof content !== 'object' || content === null || Array.isArray(content)) {
    return failure('This file is not a Loudhour rig file: it holds no rig.')
  }
  const envelope = content as Partial<Record<keyof RigFile, unknown>>
  if (envelope.format !== rigFileFormat) {
    return failure(
      `This file is not a Loudhour rig file: it does not say "format": "${rigFileFormat}".`,
    )
  }
  if (envelope.version !== rigFileVersion) {
    return failure(
      `This rig file is version ${JSON.stringify(envelope.version)}; this Loudhour reads version ${rigFileVersion}.`,
    )
  }
  const parsed = estimateRequestSchema.safeParse(envelope.rig)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]
    const where = issue && issue.path.length > 0 ? ` (at ${dottedPath(issue.path)})` : ''
    return failure(
      `The rig in this file is not valid${where}: ${issue?.message ?? 'unknown problem'}. Nothing was changed.`,
    )
  }
  const name =
    typeof envelope.name === 'string' && envelope.name.trim()
      ? envelope.name.trim()
      : 'Imported rig'
  return { ok: true, rig: parsed.data, name }
}
