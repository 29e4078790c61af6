import { defineStore } from 'pinia'
import { computed, reactive, ref, watch } from 'vue'
import { useDraftAnswer } from '@/composables/useDraftAnswer'
import { messagesByPath } from '@/display/messagesByPath'
import { estimate } from '@shared/engine'
import { exampleRigs } from '@shared/library'
import {
  estimateRequestSchema,
  type AccessorySpec,
  type AmplifierSpec,
  type EstimateRequest,
  type LeadsSpec,
  type PackSpec,
  type ProgrammeSpec,
  type SpeakerLeadsSpec,
  type SpeakersSpec,
} from '@shared/schemas/estimate'

/** Every field may be missing while someone is typing: the schema says what is still wanted. */
type Editable<T> = { [K in keyof T]?: T[K] | undefined }

/** The rig as the forms hold it; it becomes an estimate request once the shared schema passes. */
export interface RigDraft extends Omit<
  EstimateRequest,
  'pack' | 'leads' | 'speakerLeads' | 'amplifier' | 'speakers' | 'accessories' | 'programme'
> {
  pack: Editable<PackSpec>
  leads?: Editable<LeadsSpec> | undefined
  speakerLeads?: Editable<SpeakerLeadsSpec> | undefined
  amplifier: Editable<AmplifierSpec>
  speakers: Editable<SpeakersSpec>
  accessories: Editable<AccessorySpec>[]
  programme: Editable<ProgrammeSpec>
}

// Bump the version when the stored shape changes; older keys are then simply not read.
export const rigDraftStorageKey = 'loudhour.rigDraft.v1'

export const startingRig = exampleRigs[0]!

export function draftFromRequest(request: EstimateRequest): RigDraft {
  const copy = structuredClone(request)
  return { ...copy, accessories: copy.accessories ?? [] }
}

interface Restored {
  name: string
  draft: RigDraft
  message: string | null
}

/** What the browser keeps: the rig's name and the last version of it that passed the schema. */
interface StoredDraft {
  name: string
  rig: EstimateRequest
}

function restore(): Restored {
  const fresh = { name: startingRig.label, draft: draftFromRequest(startingRig.rig), message: null }
  let raw: string | null
  try {
    raw = localStorage.getItem(rigDraftStorageKey)
  } catch {
    return fresh // storage refused (private browsing): start fresh, nothing to report
  }
  if (raw === null) return fresh
  const dropped = (reason: string): Restored => ({
    ...fresh,
    message: `The rig kept in this browser could not be used (${reason}), so the bench starts from “${startingRig.label}”.`,
  })
  let stored: unknown
  try {
    stored = JSON.parse(raw)
  } catch {
    return dropped('it is not readable JSON')
  }
  const envelope = (typeof stored === 'object' && stored !== null ? stored : {}) as Partial<
    Record<keyof StoredDraft, unknown>
  >
  const parsed = estimateRequestSchema.safeParse(envelope.rig)
  if (!parsed.success) {
    const first = parsed.error.issues[0]
    return dropped(first && envelope.rig !== undefined ? first.message : 'it holds no rig')
  }
  const name = typeof envelope.name === 'string' && envelope.name ? envelope.name : 'My rig'
  return { name, draft: draftFromRequest(parsed.data), message: null }
}

function persist(stored: StoredDraft): void {
  try {
    localStorage.setItem(rigDraftStorageKey, JSON.stringify(stored))
  } catch {
    // Storage full or refused: the draft still lives for this visit.
  }
}

// The same empty map every time: nothing that shows messages re-renders for a valid change.
const noMessages: ReadonlyMap<string, string> = new Map()

/**
 * The rig on the bench: edited by the forms, checked against the shared schema on every change,
 * estimated in the browser (no round trip), and kept in this browser. Only a rig that passes the
 * schema is written to storage, so a visit never restores a half-typed rig and never loses the
 * last complete one. The estimate is computed state: the engine runs once per change of the
 * draft, however many panels read it.
 */
export const useRigDraftStore = defineStore('rigDraft', () => {
  const restored = restore()
  const draft = reactive<RigDraft>(restored.draft)
  /** What the user calls this rig (examples and imported files bring their own name). */
  const name = ref(restored.name)
  /** A note for the user about the stored rig (dropped, or replaced by an import). */
  const notice = ref<string | null>(restored.message)

  const validation = computed(() => estimateRequestSchema.safeParse(draft))
  /**
   * Fields whose typed text is not a number (path → message): the draft still holds their last
   * valid value, so the results are marked as the last valid rig's until the text is fixed.
   */
  const unreadable = reactive(new Map<string, string>())

  function markUnreadable(path: string, message: string | null): void {
    if (message === null) unreadable.delete(path)
    else unreadable.set(path, message)
  }

  watch([validation, name], ([result]) => {
    if (result.success) persist({ name: name.value, rig: result.data })
  })

  const estimated = useDraftAnswer(() => {
    const checked = validation.value
    return checked.success && unreadable.size === 0 ? checked.data : null
  }, estimate)
  /** Field path (`pack.seriesCells`, `accessories.0.powerW`) → the message shown at it. */
  const fieldIssues = computed<ReadonlyMap<string, string>>(() => {
    const checked = validation.value
    if (checked.success && unreadable.size === 0) return noMessages
    // Text that is not a number comes first: it is what the field shows.
    return messagesByPath(checked.success ? [] : checked.error.issues, unreadable)
  })
  const issueMessages = computed<readonly string[]>(() => [...fieldIssues.value.values()])

  /** Replaces the whole rig (an example, an import); the caller has already validated it. */
  function replace(request: EstimateRequest, nextName: string): void {
    name.value = nextName
    const next = draftFromRequest(request)
    const fields = draft as unknown as Record<string, unknown>
    for (const key of Object.keys(fields)) {
      if (!(key in next)) delete fields[key]
    }
    Object.assign(draft, next)
    unreadable.clear()
  }

  return {
    draft,
    name,
    notice,
    validation,
    unreadable,
    markUnreadable,
    replace,
    /** The latest estimate; while the draft is invalid, the last valid rig's (see `stale`). */
    result: estimated.answer,
    /** The validated request the result belongs to. */
    request: estimated.input,
    /** True while the result shown belongs to an earlier, valid version of the draft. */
    stale: estimated.stale,
    fieldIssues,
    /** Every field message, for a summary above the results. */
    issueMessages,
    /** Set when the engine itself failed on input that passed the schema (a bug to report). */
    engineError: estimated.error,
  }
})
