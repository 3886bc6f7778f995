import { createRouter, createWebHistory } from 'vue-router';
import { useSessionStore } from '@/stores/session';

declare module 'vue-router' {
  interface RouteMeta {
    /** Open to signed-out visitors. */
    public?: boolean;
    /** Only for signed-out visitors (a signed-in user goes to the farms). */
    guestOnly?: boolean;
    title?: string;
  }
}

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    { path: '/', name: 'home', component: () => import('@/views/HomeView.vue'), meta: { public: true, guestOnly: true } },
    { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { public: true, guestOnly: true, title: 'Sign in' } },
    { path: '/farms', name: 'farms', component: () => import('@/views/FarmsView.vue'), meta: { title: 'Farms' } },
    { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { public: true, title: 'Not found' } },
  ],
  scrollBehavior: () => ({ top: 0 }),
});

router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.ensureLoaded();
  if (!to.meta.public && !session.signedIn) return { name: 'sign-in', query: { next: to.fullPath } };
  if (to.meta.guestOnly && session.signedIn) return { name: 'farms' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Byrecast` : 'Byrecast';
});
