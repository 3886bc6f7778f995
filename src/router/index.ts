import { createRouter, createWebHistory, type RouteLocationNormalized } from 'vue-router';
import { useSessionStore } from '@/stores/session';
import { lenderToSharedView } from './lender-guard';

declare module 'vue-router' {
  interface RouteMeta {
    /** Open to signed-out visitors. */
    public?: boolean;
    /** Only for signed-out visitors (a signed-in user goes to the farms). */
    guestOnly?: boolean;
    title?: string;
    /** Which scenario workspace tab a child route is. */
    tab?: string;
  }
}

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    { path: '/', name: 'home', component: () => import('@/views/HomeView.vue'), meta: { public: true, guestOnly: true } },
    { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { public: true, guestOnly: true, title: 'Sign in' } },
    { path: '/sign-up', name: 'sign-up', component: () => import('@/views/SignUpView.vue'), meta: { public: true, guestOnly: true, title: 'Create an account' } },
    { path: '/forgot-password', name: 'forgot-password', component: () => import('@/views/ForgotPasswordView.vue'), meta: { public: true, title: 'Forgot password' } },
    { path: '/reset-password', name: 'reset-password', component: () => import('@/views/ResetPasswordView.vue'), meta: { public: true, title: 'Set a new password' } },
    { path: '/invitations/:token', name: 'accept-invitation', component: () => import('@/views/AcceptInvitationView.vue'), meta: { public: true, title: 'Invitation' } },
    { path: '/lender-shares/:token', name: 'accept-share', component: () => import('@/views/AcceptShareView.vue'), meta: { public: true, title: 'Shared for your review' } },
    { path: '/farms/:farmId(\\d+)/shared/:scenarioId(\\d+)?', name: 'lender-home', component: () => import('@/views/LenderHomeView.vue'), meta: { title: 'Shared with you' } },
    { path: '/farms/:farmId(\\d+)/audit-log', name: 'audit-log', component: () => import('@/views/AuditLogView.vue'), meta: { title: 'Lender activity' } },
    { path: '/profile', name: 'profile', component: () => import('@/views/ProfileView.vue'), meta: { title: 'Profile' } },
    { path: '/admin/users', name: 'admin-users', component: () => import('@/views/AdminUsersView.vue'), meta: { title: 'Users' } },
    { path: '/dev/outbox', name: 'dev-outbox', component: () => import('@/views/OutboxView.vue'), meta: { public: true, title: 'Outbox' } },
    { path: '/farms', name: 'farms', component: () => import('@/views/FarmsView.vue'), meta: { title: 'Farms' } },
    { path: '/farms/:farmId(\\d+)/members', name: 'farm-members', component: () => import('@/views/FarmMembersView.vue'), meta: { title: 'Members' } },
    { path: '/farms/:farmId(\\d+)', name: 'farm-home', component: () => import('@/views/FarmHomeView.vue'), meta: { title: 'Farm' }, beforeEnter: lenderToSharedView },
    { path: '/farms/:farmId(\\d+)/baseline', name: 'farm-baseline', component: () => import('@/views/FarmBaselineView.vue'), meta: { title: 'Herd and markets' } },
    { path: '/farms/:farmId(\\d+)/documents', name: 'farm-documents', component: () => import('@/views/FarmDocumentsView.vue'), meta: { title: 'Documents' } },
    { path: '/farms/:farmId(\\d+)/milk-records/import', name: 'milk-import', component: () => import('@/views/MilkImportView.vue'), meta: { title: 'Import milk records' } },
    {
      path: '/farms/:farmId(\\d+)/scenarios/:scenarioId(\\d+)',
      beforeEnter: lenderToSharedView,
      component: () => import('@/views/ScenarioWorkspaceView.vue'),
      children: [
        { path: '', name: 'scenario', component: () => import('@/views/ScenarioBuildView.vue'), meta: { title: 'Scenario' } },
        { path: 'results', name: 'scenario-results', component: () => import('@/views/ScenarioResultsView.vue'), meta: { title: 'Results', tab: 'results' } },
        { path: 'compare', name: 'scenario-compare', component: () => import('@/views/ScenarioCompareView.vue'), meta: { title: 'Compare', tab: 'compare' } },
        { path: 'risk', name: 'scenario-risk', component: () => import('@/views/ScenarioRiskView.vue'), meta: { title: 'Risk', tab: 'risk' } },
        { path: 'lender', name: 'scenario-lender', component: () => import('@/components/lender/LenderTab.vue'), meta: { title: 'Lender', tab: 'lender' } },
      ],
    },
    { path: '/farms/:farmId(\\d+)/scenarios/:scenarioId(\\d+)/print', name: 'scenario-print', component: () => import('@/views/ScenarioPrintView.vue'), meta: { title: 'Print' } },
    { path: '/farms/:farmId(\\d+)/scenarios/:scenarioId(\\d+)/versions', name: 'scenario-versions', component: () => import('@/views/VersionHistoryView.vue'), meta: { title: 'Version history' } },
    { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { public: true, title: 'Not found' } },
  ],
  scrollBehavior: () => ({ top: 0 }),
});

/**
 * Starts fetching the screen's code (every route component here is a lazy import) so it arrives
 * while the session is checked; the router would otherwise ask for it only after the guard.
 */
function preloadScreen(to: RouteLocationNormalized): void {
  for (const record of to.matched) {
    for (const component of Object.values(record.components ?? {})) {
      if (typeof component === 'function') void (component as () => Promise<unknown>)().catch(() => undefined);
    }
  }
}

router.beforeEach(async (to) => {
  const session = useSessionStore();
  preloadScreen(to);
  await session.ensureLoaded();
  if (!to.meta.public && !session.signedIn) return { name: 'sign-in', query: { next: to.fullPath } };
  if (to.meta.guestOnly && session.signedIn) return { name: 'farms' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Byrecast` : 'Byrecast';
});
