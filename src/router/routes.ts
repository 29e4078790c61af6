import type { RouteRecordInfo, RouteRecordRaw } from 'vue-router'

/**
 * Every named route, typed: `router.push({ name: 'plan', params: { planId: '1' } })` and
 * `<RouterLink :to="{ name: ... }">` fail to compile for a name or parameter that does not exist.
 */
export interface RouteNamedMap {
  bench: RouteRecordInfo<'bench', '/', Record<never, never>, Record<never, never>>
  plans: RouteRecordInfo<'plans', '/plans', Record<never, never>, Record<never, never>>
  rigs: RouteRecordInfo<'rigs', '/rigs', Record<never, never>, Record<never, never>>
  parts: RouteRecordInfo<'parts', '/parts', Record<never, never>, Record<never, never>>
  team: RouteRecordInfo<'team', '/team', Record<never, never>, Record<never, never>>
  about: RouteRecordInfo<'about', '/about', Record<never, never>, Record<never, never>>
  'not-found': RouteRecordInfo<
    'not-found',
    '/:pathMatch(.*)*',
    { pathMatch: string | string[] },
    { pathMatch: string[] }
  >
}

declare module 'vue-router' {
  interface TypesConfig {
    RouteNamedMap: RouteNamedMap
  }
  interface RouteMeta {
    /** Shown in the browser tab: "<title> · Loudhour". */
    title: string
    /** Who may open the route; guests are sent to sign-in when it says 'member'. */
    access?: 'anyone' | 'member' | 'guest'
  }
}

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    name: 'bench',
    component: () => import('@/views/BenchView.vue'),
    meta: { title: 'Rig bench' },
  },
  {
    path: '/plans',
    name: 'plans',
    component: () => import('@/views/PlansView.vue'),
    meta: { title: 'Event plans' },
  },
  {
    path: '/rigs',
    name: 'rigs',
    component: () => import('@/views/RigsView.vue'),
    meta: { title: 'Saved rigs' },
  },
  {
    path: '/parts',
    name: 'parts',
    component: () => import('@/views/PartsView.vue'),
    meta: { title: 'Parts' },
  },
  {
    path: '/team',
    name: 'team',
    component: () => import('@/views/TeamView.vue'),
    meta: { title: 'Team' },
  },
  {
    path: '/about',
    name: 'about',
    component: () => import('@/views/AboutView.vue'),
    meta: { title: 'Method and cautions' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/views/NotFoundView.vue'),
    meta: { title: 'Not found' },
  },
]
