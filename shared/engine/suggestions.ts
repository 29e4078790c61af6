// What to change when a schedule does not last: each fix is a patch to apply to the request.
import type { EstimateRequest, PackSpec } from '../schemas/estimate'
import { MAX_PACKS_SEARCHED, fitProblems, packsNeededForSchedule } from './compare'
import { estimate, prepareRig, runPrepared } from './estimate'
import { nominalWh } from './energy'
import { CHEMISTRY_DATA } from './chemistry'
import { buildPack } from './pack'
import { resolveRequest } from './resolve'

/** Top-level fields of the request to replace. */
export type RequestPatch = Partial<Pick<EstimateRequest, 'pack' | 'programme' | 'schedule'>>

export interface FixSuggestions {
  /** Whether the request as given lasts its schedule (true without a schedule: nothing to fix). */
  lasts: boolean
  /** Smallest whole-dB level drop (≥ 1 dB) that makes it last. */
  levelDrop: { db: number; patch: RequestPatch } | null
  /** Extra charged packs needed (with swaps at once as each runs out). */
  extraPacks: { count: number; patch: RequestPatch } | null
  /** The smallest candidate with more energy than the current pack that fits and lasts with the same count. */
  largerPack: { index: number; label: string | null; nominalWh: number; patch: RequestPatch } | null
}

const MAX_LEVEL_DB = 60 // the schema's ceiling for peakBelowClipDb

export function applyPatch(request: EstimateRequest, patch: RequestPatch): EstimateRequest {
  return { ...request, ...patch }
}

function lastsSchedule(request: EstimateRequest): boolean {
  const prepared = prepareRig(request)
  const outcome = runPrepared(prepared, prepared.resolved.pack.count, false)
  return outcome.stopReason === 'schedule-end'
}

/** Every level (programme and segments) lowered by `db`, capped at the schema's ceiling. */
function quieterBy(request: EstimateRequest, db: number): RequestPatch {
  const lower = (levelDb: number) => Math.min(levelDb + db, MAX_LEVEL_DB)
  return {
    programme: { ...request.programme, peakBelowClipDb: lower(request.programme.peakBelowClipDb) },
    ...(request.schedule
      ? {
          schedule: request.schedule.map((segment) =>
            segment.peakBelowClipDb === undefined
              ? segment
              : { ...segment, peakBelowClipDb: lower(segment.peakBelowClipDb) },
          ),
        }
      : {}),
  }
}

// ours: packs within 10 % of the same nominal voltage count as one class (e.g. 5S li-ion and
// 15S NiMH, both 18 V); a larger pack is suggested only from the rig's own class.
const SAME_CLASS_V_FRACTION = 0.1

function packNominalV(pack: PackSpec): number {
  return pack.seriesCells * CHEMISTRY_DATA[pack.chemistry].nominalCellV
}

function packNominalWh(request: EstimateRequest, pack: PackSpec): number {
  const { resolved } = resolveRequest({ ...request, pack })
  const model = buildPack(resolved.pack, resolved.temperatureC)
  return nominalWh(model.nominalV, model.ratedCapacityAh)
}

export function suggestFixes(
  request: EstimateRequest,
  candidatePacks: readonly PackSpec[] = [],
): FixSuggestions {
  if (!request.schedule || lastsSchedule(request)) {
    return { lasts: true, levelDrop: null, extraPacks: null, largerPack: null }
  }

  // Runtime does not rise with level (a property test holds the engine to it), so a bisection
  // over whole dB finds the smallest drop that lasts.
  let levelDrop: FixSuggestions['levelDrop'] = null
  if (lastsSchedule(applyPatch(request, quieterBy(request, MAX_LEVEL_DB)))) {
    let tooLittle = 0
    let enough = MAX_LEVEL_DB
    while (enough - tooLittle > 1) {
      const middle = Math.floor((tooLittle + enough) / 2)
      if (lastsSchedule(applyPatch(request, quieterBy(request, middle)))) enough = middle
      else tooLittle = middle
    }
    levelDrop = { db: enough, patch: quieterBy(request, enough) }
  }

  const count = request.pack.count ?? 1
  const needed = packsNeededForSchedule(request)
  const extraPacks =
    needed !== null && needed > count && needed <= MAX_PACKS_SEARCHED
      ? { count: needed - count, patch: { pack: { ...request.pack, count: needed } } }
      : null

  const currentWh = packNominalWh(request, request.pack)
  const currentV = packNominalV(request.pack)
  const larger = candidatePacks
    .map((pack, index) => ({ pack, index, nominalWh: packNominalWh(request, pack) }))
    // Only the same voltage class: another class changes the amplifier's supply and every
    // converter verdict, which is a different rig rather than a larger pack.
    .filter(
      (candidate) =>
        Math.abs(packNominalV(candidate.pack) - currentV) <= SAME_CLASS_V_FRACTION * currentV,
    )
    .filter((candidate) => candidate.nominalWh > currentWh)
    .sort((a, b) => a.nominalWh - b.nominalWh)
  let largerPack: FixSuggestions['largerPack'] = null
  for (const candidate of larger) {
    const pack = { ...candidate.pack, count }
    const patched = applyPatch(request, { pack })
    // A pack that would harm or starve a part is never offered, however long it lasts.
    if (lastsSchedule(patched) && fitProblems(estimate(patched)).length === 0) {
      largerPack = {
        index: candidate.index,
        label: candidate.pack.label ?? null,
        nominalWh: candidate.nominalWh,
        patch: { pack },
      }
      break
    }
  }
  return { lasts: false, levelDrop, extraPacks, largerPack }
}
