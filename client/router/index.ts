import { createRouter, createWebHistory } from 'vue-router';
import { useSessionStore } from '../stores/session';
import { routes } from './routes';

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
});

// The one global guard: access rules live in route meta. The server stays the authority.
router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.load();
  if (to.meta.requiresAuth && !session.member)
    return { name: 'sign-in', query: { next: to.fullPath } };
  if (to.meta.roles && (!session.member || !to.meta.roles.includes(session.member.role)))
    return { name: 'not-found', params: { pathMatch: to.path.slice(1).split('/') } };
  if (to.meta.guestOnly && session.member) return { name: 'discover' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Rindwise` : 'Rindwise';
});
