import { computed, reactive, ref, watch, type Ref } from 'vue'
import { eventsApi, previewEvent } from '@/api/events'
import { plansApi } from '@/api/plans'
import type { PlanItem } from '@shared/schemas/plans'
import {
  eventPreviewSchema,
  type EventAnswer,
  type EventBody,
  type EventCharger,
  type EventItem,
} from '@shared/schemas/events'

/** The event being edited: its fields, the team's plans to pick from, and the live answer. */
export function useEventEditor(teamId: Ref<number | undefined>, eventId: Ref<number | undefined>) {
  const form = reactive({
    name: '',
    notes: '',
    date: new Date().toISOString().slice(0, 10),
    planIds: [] as number[],
    pool: {} as Record<string, number>,
    chargers: [] as EventCharger[],
  })
  const saved = ref<EventItem | undefined>()
  const plans = ref<PlanItem[]>([])
  const answer = ref<EventAnswer | undefined>()
  const loading = ref(false)
  const error = ref<string | undefined>()
  const previewError = ref<string | undefined>()

  function fill(item: EventItem): void {
    saved.value = item
    form.name = item.name
    form.notes = item.notes
    form.date = item.date
    form.planIds = [...item.planIds]
    form.pool = Object.fromEntries(item.pool.map((entry) => [entry.kind, entry.count]))
    form.chargers = item.chargers.map((charger) => ({
      ...charger,
      packKinds: [...charger.packKinds],
    }))
    answer.value = item.answer
    countNewKinds(item.answer)
    savedBodyJson.value = JSON.stringify(body.value)
  }

  async function load(): Promise<void> {
    const team = teamId.value
    if (team === undefined) return
    loading.value = true
    try {
      plans.value = (await plansApi.list(team, { limit: 200, sort: 'name' })).items
      if (eventId.value !== undefined) fill(await eventsApi.get(team, eventId.value))
      error.value = undefined
    } catch (caught) {
      error.value = caught instanceof Error ? caught.message : 'The event could not be loaded.'
    } finally {
      loading.value = false
    }
  }
  watch([teamId, eventId], load, { immediate: true })

  /** The body as the server takes it (the pool as a list). */
  const body = computed<EventBody>(() => ({
    name: form.name,
    notes: form.notes,
    date: form.date,
    planIds: form.planIds,
    pool: Object.entries(form.pool).map(([kind, count]) => ({ kind, count })),
    chargers: form.chargers,
  }))

  // Kinds the answer names get a count the first time they appear: one pack, so the answer
  // starts from something and says how many more to bring.
  function countNewKinds(next: EventAnswer | undefined): void {
    for (const kind of next?.kinds ?? []) if (!(kind.key in form.pool)) form.pool[kind.key] = 1
  }
  watch(answer, countNewKinds)

  // What was last saved (or the blank form of a new event): anything else is unsaved work.
  const savedBodyJson = ref(JSON.stringify(body.value))
  const dirty = computed(() => JSON.stringify(body.value) !== savedBodyJson.value)

  let previewTimer: ReturnType<typeof setTimeout> | undefined
  let previewSequence = 0
  watch(
    () => JSON.stringify([form.planIds, form.pool, form.chargers]),
    () => {
      clearTimeout(previewTimer)
      previewTimer = setTimeout(() => void refresh(), 300)
    },
  )

  async function refresh(): Promise<void> {
    const team = teamId.value
    if (team === undefined) return
    const parsed = eventPreviewSchema.safeParse(body.value)
    if (!parsed.success) {
      previewError.value = parsed.error.issues[0]?.message
      return
    }
    const sequence = ++previewSequence
    try {
      const next = await previewEvent(team, parsed.data)
      if (sequence !== previewSequence) return
      answer.value = next
      previewError.value = undefined
    } catch (caught) {
      if (sequence !== previewSequence) return
      previewError.value =
        caught instanceof Error ? caught.message : 'The answer could not be worked out.'
    }
  }

  return {
    form,
    saved,
    plans,
    answer,
    loading,
    error,
    previewError,
    body,
    dirty,
    fill,
    refresh,
  }
}
