import { createRouter, createWebHistory, type Router, type RouterHistory } from 'vue-router'
import { routes } from './routes'
import { installSessionGuards } from './guards'

export function createAppRouter(history: RouterHistory = createWebHistory()): Router {
  const router = createRouter({
    history,
    routes,
    scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
  })
  installSessionGuards(router)
  router.afterEach((to) => {
    document.title = to.meta.title ? `${to.meta.title} · Loudhour` : 'Loudhour'
  })
  return router
}
