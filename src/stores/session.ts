import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as authApi from '@/api/auth'
import { ApiRequestError } from '@/api/http'
import { forgetOfflineAnswers } from '@/offline/apiCache'
import type { MeResponse, TeamView } from '@shared/schemas/account-responses'
import type { SignInInput, SignUpInput } from '@shared/schemas/auth'

const currentTeamKey = 'loudhour.current-team.v1'

function storedTeamId(): number | undefined {
  try {
    const value = Number(localStorage.getItem(currentTeamKey))
    return Number.isSafeInteger(value) && value > 0 ? value : undefined
  } catch {
    return undefined
  }
}

/** Who is signed in, their teams, and which team the app is working in. */
export const useSessionStore = defineStore('session', () => {
  const me = ref<MeResponse | undefined>()
  /** 'unknown' until the first `load()` has answered. */
  const status = ref<'unknown' | 'signed-in' | 'signed-out'>('unknown')
  const chosenTeamId = ref<number | undefined>(storedTeamId())
  let loading: Promise<void> | undefined

  const user = computed(() => me.value?.user)
  const teams = computed<TeamView[]>(() => me.value?.teams ?? [])
  const currentTeam = computed<TeamView | undefined>(
    () => teams.value.find((team) => team.id === chosenTeamId.value) ?? teams.value[0],
  )
  const currentTeamId = computed(() => currentTeam.value?.id)
  const isAdminSomewhere = computed(() => teams.value.some((team) => team.role === 'admin'))
  // Everyone may look: admins find their teams' mail, and a confirmed address its own.
  const outboxAvailable = computed(() => !!me.value?.devOutbox)

  function apply(answer: MeResponse): void {
    me.value = answer
    status.value = 'signed-in'
  }

  function markSignedOut(): void {
    me.value = undefined
    status.value = 'signed-out'
  }

  /** No session (ended, or none): also forget the account's answers kept for offline use. */
  function clear(): void {
    markSignedOut()
    void forgetOfflineAnswers()
  }

  /** Asks the server who is signed in; an unreachable server counts as signed out. */
  async function load(): Promise<void> {
    try {
      const { session } = await authApi.fetchSession()
      if (session) apply(session)
      else clear()
    } catch (error) {
      if (!(error instanceof ApiRequestError)) throw error
      // Unreachable (offline with nothing kept): signed out for now, the kept answers stay.
      markSignedOut()
    }
  }

  /** Loads once; later calls wait for the same answer. */
  function ensureLoaded(): Promise<void> {
    if (status.value !== 'unknown') return Promise.resolve()
    loading ??= load().finally(() => (loading = undefined))
    return loading
  }

  async function signIn(input: SignInInput): Promise<void> {
    apply(await authApi.signIn(input))
  }

  /** Asks for an account; signs nobody in (the answer does not say whether one was made). */
  async function signUp(input: SignUpInput): Promise<string> {
    return (await authApi.signUp(input)).message
  }

  async function signOut(): Promise<void> {
    await authApi.signOut()
    clear()
  }

  async function signOutEverywhere(): Promise<void> {
    await authApi.signOutEverywhere()
    clear()
  }

  function chooseTeam(teamId: number): void {
    chosenTeamId.value = teamId
    try {
      localStorage.setItem(currentTeamKey, String(teamId))
    } catch {
      // Storage refused (private browsing): the choice holds for this visit.
    }
  }

  return {
    me,
    status,
    user,
    teams,
    currentTeam,
    currentTeamId,
    isAdminSomewhere,
    outboxAvailable,
    apply,
    clear,
    load,
    ensureLoaded,
    signIn,
    signUp,
    signOut,
    signOutEverywhere,
    chooseTeam,
  }
})
