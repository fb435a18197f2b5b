import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { Capability } from '#shared/permissions'
import { can as roleCan } from '#shared/permissions'
import type { Role } from '#shared/schemas/membership'
import { defaultPreferences, type UnitPreferences } from '#shared/schemas/preferences'

export interface SessionWorkshop { id: string; name: string; role: Role }
export interface SessionState {
  user: { id: string; email: string; name: string; mustChangePassword: boolean } | null
  preferences?: UnitPreferences
  workshops?: SessionWorkshop[]
  workshop?: SessionWorkshop | null
  role?: Role | null
}

/** The signed-in user, the current workshop and the user's display units. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionState['user']>(null)
  const workshops = ref<SessionWorkshop[]>([])
  const workshop = ref<SessionWorkshop | null>(null)
  const role = ref<Role | null>(null)
  const preferences = ref<UnitPreferences>({ ...defaultPreferences })
  const loaded = ref(false)
  const api = useApi()

  function apply(state: SessionState) {
    user.value = state.user
    workshops.value = state.workshops ?? []
    workshop.value = state.workshop ?? null
    role.value = state.role ?? null
    preferences.value = { ...defaultPreferences, ...state.preferences }
    loaded.value = true
  }

  async function refresh() {
    apply(await api<SessionState>('/api/session'))
  }

  async function signIn(email: string, password: string) {
    const result = await api<{ mustChangePassword: boolean }>('/api/session', { method: 'POST', body: { email, password } })
    await refresh()
    return result
  }

  async function signOut() {
    await api('/api/session', { method: 'DELETE' })
    apply({ user: null })
  }

  async function switchWorkshop(id: string) {
    apply(await api<SessionState>(`/api/workshops/${id}/switch`, { method: 'POST' }))
  }

  async function updateAccount(patch: { name?: string; preferences?: Partial<UnitPreferences> }) {
    apply(await api<SessionState>('/api/account', { method: 'PATCH', body: patch }))
  }

  const signedIn = computed(() => user.value !== null)
  const can = (capability: Capability) => roleCan(role.value, capability)

  return { user, workshops, workshop, role, preferences, loaded, signedIn, apply, refresh, signIn, signOut, switchWorkshop, updateAccount, can }
})
