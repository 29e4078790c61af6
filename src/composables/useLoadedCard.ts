import { ref, watch, type Ref, type WatchSource } from 'vue'

/**
 * A card loaded whenever its source changes (a team and a plan or event, or a share token): the
 * card, or the message that says why there is none. `fetchCard` answers undefined while there is
 * nothing to load yet (no team chosen).
 */
export function useLoadedCard<Source, Card>(
  source: WatchSource<Source>,
  fetchCard: (value: Source) => Promise<Card> | undefined,
) {
  const card = ref<Card>() as Ref<Card | undefined>
  const loadError = ref<string | undefined>()
  const loading = ref(false)
  watch(
    source,
    async (value) => {
      const pending = fetchCard(value)
      if (!pending) return
      loading.value = true
      try {
        card.value = await pending
        loadError.value = undefined
      } catch (error) {
        card.value = undefined
        loadError.value = error instanceof Error ? error.message : 'The card could not be loaded.'
      } finally {
        loading.value = false
      }
    },
    { immediate: true },
  )
  return { card, loadError, loading }
}
