import { computed, reactive, ref, watch, type Ref } from 'vue'
import { ApiRequestError } from '@/api/http'
import { plansApi } from '@/api/plans'
import { packsApi, rigsApi } from '@/api/resources'
import { bodyOfDraft, draftFromPlan, emptyDraft, type PlanDraft } from '@/components/plan/planDraft'
import { messagesByPath } from '@/display/messagesByPath'
import { estimate } from '@shared/engine'
import { planEstimateRequest } from '@shared/plans/request'
import {
  estimateRequestSchema,
  type EstimateRequest,
  type PackSpec,
} from '@shared/schemas/estimate'
import { planBodySchema, type PlanBody, type PlanItem } from '@shared/schemas/plans'
import type { PackItem, RigItem } from '@shared/schemas/resources'
import { useDraftAnswer } from './useDraftAnswer'
import { useTeamAccess } from './useTeamAccess'

const LIST_ALL = { limit: 200, sort: 'name' } as const

/** A plan that passed the schema, with the estimate request of its day on the chosen rig. */
export interface CheckedPlan {
  body: PlanBody
  request: EstimateRequest
}

function message(error: unknown, fallback: string): string {
  return error instanceof Error ? error.message : fallback
}

/**
 * One plan being edited: loads it with the team's rigs and packs, checks the draft with the
 * shared schema on every change, works the day out in the browser from the chosen rig (computed
 * state: the engine runs once per change, and the last valid plan's day stays while the draft is
 * not valid), saves (409 when someone saved first), and puts another pack into the rig.
 */
export function usePlanEditor(
  planId: Ref<number | null>,
  /** For a new plan: the rig to start on (from the bench's "Plan a day with this rig"). */
  startRigId: Ref<number | null> = ref(null),
) {
  const { teamId, canEdit } = useTeamAccess()
  const draft = reactive<PlanDraft>(emptyDraft())
  const saved = ref<PlanItem | null>(null)
  const savedBodyJson = ref(JSON.stringify(bodyOfDraft(draft)))
  const rigs = ref<RigItem[]>([])
  const teamPacks = ref<PackItem[]>([])
  const loading = ref(false)
  const loadError = ref<string | null>(null)
  const saving = ref(false)
  const saveError = ref<string | null>(null)
  /** Issues the server named (a rig of another team): shown beside the fields like the schema's. */
  const serverIssues = ref<ReadonlyMap<string, string>>(new Map())
  /**
   * Number fields whose typed text is not a number (field id → message): the draft keeps their
   * last value, so the day shown is the last valid plan's, and saving waits (it would keep the
   * old value without a word).
   */
  const unreadable = reactive(new Map<string, string>())

  function markUnreadable(fieldId: string, message: string | null): void {
    if (message === null) unreadable.delete(fieldId)
    else unreadable.set(fieldId, message)
  }

  function replaceDraft(next: PlanDraft): void {
    Object.assign(draft, next)
    savedBodyJson.value = JSON.stringify(bodyOfDraft(draft))
  }

  async function load(): Promise<void> {
    const team = teamId.value
    if (team === undefined) return
    loading.value = true
    loadError.value = null
    try {
      const [rigList, packList, plan] = await Promise.all([
        rigsApi.list(team, LIST_ALL),
        packsApi.list(team, LIST_ALL),
        planId.value === null ? Promise.resolve(null) : plansApi.get(team, planId.value),
      ])
      rigs.value = rigList.items
      teamPacks.value = packList.items
      saved.value = plan
      const startRig = rigList.items.find((item) => item.id === startRigId.value)
      replaceDraft(plan ? draftFromPlan(plan) : emptyDraft((startRig ?? rigList.items[0])?.id))
    } catch (error) {
      loadError.value =
        error instanceof ApiRequestError && error.status === 404
          ? 'There is no such plan in this team (it may have been deleted).'
          : message(error, 'The plan could not be loaded.')
    } finally {
      loading.value = false
    }
  }
  watch([teamId, planId], () => void load(), { immediate: true })

  const validation = computed(() => planBodySchema.safeParse(bodyOfDraft(draft)))
  const fieldIssues = computed(() =>
    messagesByPath(
      validation.value.success ? [] : validation.value.error.issues,
      serverIssues.value,
    ),
  )
  watch(
    () => JSON.stringify(bodyOfDraft(draft)),
    () => (serverIssues.value = new Map()),
  )

  const rig = computed(() => rigs.value.find((candidate) => candidate.id === draft.rigId) ?? null)
  const dirty = computed(() => JSON.stringify(bodyOfDraft(draft)) !== savedBodyJson.value)

  /** The plan and its day's estimate request, or null while either does not pass the schema. */
  const checked = computed<CheckedPlan | null>(() => {
    const body = validation.value.success ? validation.value.data : null
    if (!body || !rig.value) return null
    const parsed = estimateRequestSchema.safeParse(
      planEstimateRequest(rig.value.spec, {
        temperatureC: body.temperatureC ?? null,
        packCount: body.packCount ?? null,
        swapPolicy: body.swapPolicy ?? null,
        schedule: body.schedule,
      }),
    )
    return parsed.success ? { body, request: parsed.data } : null
  })
  const day = useDraftAnswer(
    () => (unreadable.size === 0 ? checked.value : null),
    (plan) => estimate(plan.request),
  )
  /** The draft passes the schema and every number field reads: what saving needs. */
  const complete = computed(() => validation.value.success && unreadable.size === 0)

  async function save(): Promise<PlanItem | null> {
    const team = teamId.value
    if (team === undefined || !validation.value.success) return null
    const body: PlanBody = validation.value.data
    saving.value = true
    saveError.value = null
    try {
      const current = saved.value
      const answer = current
        ? await plansApi.update(team, current.id, { ...body, version: current.version })
        : await plansApi.create(team, body)
      saved.value = answer
      savedBodyJson.value = JSON.stringify(bodyOfDraft(draft))
      return answer
    } catch (error) {
      if (error instanceof ApiRequestError && error.issues.length > 0) {
        serverIssues.value = messagesByPath(error.issues)
      }
      saveError.value = message(error, 'The plan could not be saved.')
      return null
    } finally {
      saving.value = false
    }
  }

  /**
   * Saves the rig with this pack in it (the count of packs on hand stays the rig's). Every plan
   * on the rig runs on it from then on; the server recomputes their summaries.
   */
  async function putPackInRig(pack: PackSpec, packId: number | null): Promise<RigItem> {
    const team = teamId.value
    const current = rig.value
    if (team === undefined || !current) throw new Error('Choose a rig first.')
    const updated = await rigsApi.update(team, current.id, {
      name: current.name,
      notes: current.notes,
      spec: { ...current.spec, pack: { ...pack, count: current.spec.pack.count } },
      packId,
      amplifierId: current.amplifierId,
      speakersId: current.speakersId,
      accessoryIds: current.accessoryIds,
      version: current.version,
    })
    rigs.value = rigs.value.map((candidate) => (candidate.id === updated.id ? updated : candidate))
    return updated
  }

  return {
    teamId,
    canEdit,
    draft,
    saved,
    rigs,
    rig,
    teamPacks,
    loading,
    loadError,
    saving,
    saveError,
    validation,
    fieldIssues,
    unreadable,
    markUnreadable,
    complete,
    /** The day's result; while the draft is not valid, the last valid plan's (see `stale`). */
    result: day.answer,
    /** The checked plan and request the result belongs to. */
    resultPlan: day.input,
    /** True while the day shown is the last valid plan's. */
    stale: day.stale,
    /** Set when the engine failed on a request that passed the schema (a bug to report). */
    engineError: day.error,
    dirty,
    load,
    save,
    putPackInRig,
  }
}

export type PlanEditor = ReturnType<typeof usePlanEditor>
