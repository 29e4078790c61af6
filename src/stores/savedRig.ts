import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import { rigsApi } from '@/api/resources'
import type { RigPartReferences } from '@/composables/useRigPartReferences'
import type { RigBody, RigItem } from '@shared/schemas/resources'
import { useRigDraftStore } from './rigDraft'

/** Which saved rig the bench holds, and the version and values it was opened or saved at. */
export interface SavedRigLink {
  teamId: number
  rigId: number
  version: number
  name: string
  notes: string
  /** The spec as saved, as JSON: the bench has unsaved changes when its rig differs from it. */
  savedSpecJson: string
  references: RigPartReferences
}

const storageKey = 'loudhour.savedRig.v1'

function loadLink(): SavedRigLink | null {
  try {
    const raw = localStorage.getItem(storageKey)
    const parsed = raw ? (JSON.parse(raw) as Partial<SavedRigLink>) : null
    return parsed &&
      typeof parsed.teamId === 'number' &&
      typeof parsed.rigId === 'number' &&
      typeof parsed.version === 'number' &&
      typeof parsed.name === 'string' &&
      typeof parsed.savedSpecJson === 'string'
      ? ({ notes: '', references: {}, ...parsed } as SavedRigLink)
      : null
  } catch {
    return null
  }
}

/**
 * The link between the bench's draft (rigDraft.ts, which it leaves as it is) and a rig saved for
 * a team: open, save, save as, rename, and the unsaved-changes test for the guards. Replacing the
 * draft with an example or an imported file ends the link, so a save never overwrites a saved
 * rig with something else by surprise.
 */
export const useSavedRigStore = defineStore('savedRig', () => {
  const bench = useRigDraftStore()
  const link = ref<SavedRigLink | null>(loadLink())
  let opening = false

  watch(
    link,
    (value) => {
      try {
        if (value) localStorage.setItem(storageKey, JSON.stringify(value))
        else localStorage.removeItem(storageKey)
      } catch {
        // Storage refused: the link lasts for this visit.
      }
    },
    { deep: true },
  )

  bench.$onAction(({ name, after }) => {
    if (name === 'replace' && !opening) after(() => (link.value = null))
  })

  const benchSpecJson = computed(() =>
    bench.validation.success ? JSON.stringify(bench.validation.data) : undefined,
  )

  /** True when the bench holds a saved rig and its values or name differ from the saved ones. */
  const hasUnsavedChanges = computed(
    () =>
      link.value !== null &&
      (bench.name !== link.value.name || benchSpecJson.value !== link.value.savedSpecJson),
  )

  function linkTo(teamId: number, rig: RigItem): void {
    opening = true
    try {
      bench.replace(rig.spec, rig.name)
    } finally {
      opening = false
    }
    link.value = {
      teamId,
      rigId: rig.id,
      version: rig.version,
      name: rig.name,
      notes: rig.notes,
      // What the bench's own schema pass makes of the spec, so a fresh open compares equal.
      savedSpecJson: benchSpecJson.value ?? JSON.stringify(rig.spec),
      references: {
        packId: rig.packId,
        amplifierId: rig.amplifierId,
        speakersId: rig.speakersId,
        accessoryIds: rig.accessoryIds,
      },
    }
  }

  async function open(teamId: number, rigId: number): Promise<RigItem> {
    const rig = await rigsApi.get(teamId, rigId)
    linkTo(teamId, rig)
    return rig
  }

  function currentSpec() {
    if (!bench.validation.success) {
      throw new Error('The rig has fields marked in red; correct them before saving.')
    }
    return bench.validation.data
  }

  /**
   * Saves over the linked rig with the version it was opened at (409 when someone saved since).
   * `references` are the team parts the rig now uses (useRigPartReferences); without them the
   * rig keeps the ones it had.
   */
  async function save(references?: RigPartReferences): Promise<RigItem> {
    const current = link.value
    if (!current) throw new Error('This rig is not saved for a team yet: use “Save as new”.')
    const saved = await rigsApi.update(current.teamId, current.rigId, {
      name: bench.name,
      notes: current.notes,
      spec: currentSpec(),
      ...(references ?? current.references),
      version: current.version,
    })
    linkTo(current.teamId, saved)
    return saved
  }

  /** Saves the bench's rig as a new rig of the team, and links the bench to it. */
  async function saveAsNew(
    teamId: number,
    name: string,
    references?: RigPartReferences,
  ): Promise<RigItem> {
    const current = link.value
    const saved = await rigsApi.create(teamId, {
      name,
      notes: current?.notes ?? '',
      spec: currentSpec(),
      ...(references ?? (current?.teamId === teamId ? current.references : {})),
    })
    linkTo(teamId, saved)
    return saved
  }

  /** Renames the saved rig without saving other changes on the bench. */
  async function rename(name: string): Promise<RigItem> {
    const current = link.value
    if (!current) throw new Error('Only a saved rig can be renamed.')
    const unsavedSpec = benchSpecJson.value
    const saved = await rigsApi.update(current.teamId, current.rigId, {
      name,
      notes: current.notes,
      spec: JSON.parse(current.savedSpecJson) as RigBody['spec'],
      ...current.references,
      version: current.version,
    })
    const keptSpec = unsavedSpec ?? current.savedSpecJson
    linkTo(current.teamId, saved)
    // The bench keeps what the user was working on; only the name and version moved on.
    if (keptSpec !== current.savedSpecJson) {
      opening = true
      try {
        bench.replace(JSON.parse(keptSpec) as RigBody['spec'], name)
      } finally {
        opening = false
      }
    }
    return saved
  }

  function unlink(): void {
    link.value = null
  }

  return { link, hasUnsavedChanges, open, save, saveAsNew, rename, unlink }
})
