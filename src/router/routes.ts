import type { RouteRecordInfo, RouteRecordRaw } from 'vue-router'

/**
 * Every named route, typed: `router.push({ name: 'plan', params: { planId: '1' } })` and
 * `<RouterLink :to="{ name: ... }">` fail to compile for a name or parameter that does not exist.
 */
export interface RouteNamedMap {
  bench: RouteRecordInfo<'bench', '/', Record<never, never>, Record<never, never>>
  plans: RouteRecordInfo<'plans', '/plans', Record<never, never>, Record<never, never>>
  'plan-new': RouteRecordInfo<'plan-new', '/plans/new', Record<never, never>, Record<never, never>>
  plan: RouteRecordInfo<'plan', '/plans/:planId', { planId: string | number }, { planId: string }>
  'plan-card': RouteRecordInfo<
    'plan-card',
    '/plans/:planId/card',
    { planId: string | number },
    { planId: string }
  >
  events: RouteRecordInfo<'events', '/events', Record<never, never>, Record<never, never>>
  'event-new': RouteRecordInfo<
    'event-new',
    '/events/new',
    Record<never, never>,
    Record<never, never>
  >
  event: RouteRecordInfo<
    'event',
    '/events/:eventId',
    { eventId: string | number },
    { eventId: string }
  >
  'event-card': RouteRecordInfo<
    'event-card',
    '/events/:eventId/card',
    { eventId: string | number },
    { eventId: string }
  >
  'shared-event-card': RouteRecordInfo<
    'shared-event-card',
    '/shared/events/:token',
    { token: string },
    { token: string }
  >
  'rig-card': RouteRecordInfo<
    'rig-card',
    '/rigs/:rigId/card',
    { rigId: string | number },
    { rigId: string }
  >
  'shared-card': RouteRecordInfo<
    'shared-card',
    '/shared/:token',
    { token: string },
    { token: string }
  >
  rigs: RouteRecordInfo<'rigs', '/rigs', Record<never, never>, Record<never, never>>
  parts: RouteRecordInfo<'parts', '/parts', Record<never, never>, Record<never, never>>
  pack: RouteRecordInfo<
    'pack',
    '/parts/packs/:packId',
    { packId: string | number },
    { packId: string }
  >
  team: RouteRecordInfo<'team', '/team', Record<never, never>, Record<never, never>>
  about: RouteRecordInfo<'about', '/about', Record<never, never>, Record<never, never>>
  'sign-in': RouteRecordInfo<'sign-in', '/sign-in', Record<never, never>, Record<never, never>>
  'sign-up': RouteRecordInfo<'sign-up', '/sign-up', Record<never, never>, Record<never, never>>
  'forgot-password': RouteRecordInfo<
    'forgot-password',
    '/forgot-password',
    Record<never, never>,
    Record<never, never>
  >
  'reset-password': RouteRecordInfo<
    'reset-password',
    '/reset-password',
    Record<never, never>,
    Record<never, never>
  >
  'accept-invitation': RouteRecordInfo<
    'accept-invitation',
    '/invitations/accept',
    Record<never, never>,
    Record<never, never>
  >
  'verify-email': RouteRecordInfo<
    'verify-email',
    '/verify-email',
    Record<never, never>,
    Record<never, never>
  >
  account: RouteRecordInfo<'account', '/account', Record<never, never>, Record<never, never>>
  outbox: RouteRecordInfo<'outbox', '/outbox', Record<never, never>, Record<never, never>>
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
    /** Shown without the app's header and footer (a shared card, for people without accounts). */
    bare?: boolean
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
    meta: { title: 'Event plans', access: 'member' },
  },
  {
    path: '/plans/new',
    name: 'plan-new',
    component: () => import('@/views/PlanView.vue'),
    meta: { title: 'New event plan', access: 'member' },
  },
  {
    path: '/plans/:planId(\\d+)',
    name: 'plan',
    component: () => import('@/views/PlanView.vue'),
    meta: { title: 'Event plan', access: 'member' },
  },
  {
    path: '/plans/:planId(\\d+)/card',
    name: 'plan-card',
    component: () => import('@/views/PlanCardView.vue'),
    meta: { title: 'Runtime card', access: 'member' },
  },
  {
    path: '/events',
    name: 'events',
    component: () => import('@/views/EventsView.vue'),
    meta: { title: 'Events', access: 'member' },
  },
  {
    path: '/events/new',
    name: 'event-new',
    component: () => import('@/views/EventView.vue'),
    meta: { title: 'New event', access: 'member' },
  },
  {
    path: '/events/:eventId(\\d+)',
    name: 'event',
    component: () => import('@/views/EventView.vue'),
    meta: { title: 'Event', access: 'member' },
  },
  {
    path: '/events/:eventId(\\d+)/card',
    name: 'event-card',
    component: () => import('@/views/EventCardView.vue'),
    meta: { title: 'Event card', access: 'member' },
  },
  // The page behind an event's share link (GET /api/v1/shared/events/:token), signed out.
  {
    path: '/shared/events/:token',
    name: 'shared-event-card',
    component: () => import('@/views/SharedEventCardView.vue'),
    meta: { title: 'Event card', bare: true },
  },
  {
    path: '/rigs/:rigId(\\d+)/card',
    name: 'rig-card',
    component: () => import('@/views/RigCardView.vue'),
    meta: { title: 'Rig card', access: 'member' },
  },
  // The page behind a share link (docs/api.md: GET /api/v1/shared/:token), signed out.
  {
    path: '/shared/:token',
    name: 'shared-card',
    component: () => import('@/views/SharedCardView.vue'),
    meta: { title: 'Runtime card', bare: true },
  },
  {
    path: '/rigs',
    name: 'rigs',
    component: () => import('@/views/RigsView.vue'),
    meta: { title: 'Saved rigs', access: 'member' },
  },
  {
    path: '/parts',
    name: 'parts',
    component: () => import('@/views/PartsView.vue'),
    meta: { title: 'Parts', access: 'member' },
  },
  {
    path: '/parts/packs/:packId',
    name: 'pack',
    component: () => import('@/views/PackView.vue'),
    meta: { title: 'Pack', access: 'member' },
  },
  {
    path: '/team',
    name: 'team',
    component: () => import('@/views/TeamView.vue'),
    meta: { title: 'Team', access: 'member' },
  },
  {
    path: '/about',
    name: 'about',
    component: () => import('@/views/AboutView.vue'),
    meta: { title: 'Method and cautions' },
  },
  // Accounts. Links in e-mails point at /reset-password, /verify-email and /invitations/accept.
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/views/SignInView.vue'),
    meta: { title: 'Sign in', access: 'guest' },
  },
  {
    path: '/sign-up',
    name: 'sign-up',
    component: () => import('@/views/SignUpView.vue'),
    meta: { title: 'Create an account', access: 'guest' },
  },
  {
    path: '/forgot-password',
    name: 'forgot-password',
    component: () => import('@/views/ForgotPasswordView.vue'),
    meta: { title: 'Forgotten password' },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('@/views/ResetPasswordView.vue'),
    meta: { title: 'Choose a new password' },
  },
  {
    path: '/verify-email',
    name: 'verify-email',
    component: () => import('@/views/VerifyEmailView.vue'),
    meta: { title: 'Confirm your address' },
  },
  {
    path: '/invitations/accept',
    name: 'accept-invitation',
    component: () => import('@/views/AcceptInvitationView.vue'),
    meta: { title: 'Team invitation', access: 'member' },
  },
  {
    path: '/account',
    name: 'account',
    component: () => import('@/views/AccountView.vue'),
    meta: { title: 'Account', access: 'member' },
  },
  {
    path: '/outbox',
    name: 'outbox',
    component: () => import('@/views/OutboxView.vue'),
    meta: { title: 'Local mail outbox', access: 'member' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/views/NotFoundView.vue'),
    meta: { title: 'Not found' },
  },
]
