import type { RouteRecordRaw } from 'vue-router';
import type { Role } from '@shared/types/member';

declare module 'vue-router' {
  interface RouteMeta {
    /** Only signed-in members may open the route. */
    requiresAuth?: boolean;
    /** Only these roles may open the route. */
    roles?: Role[];
    /** Signed-in members are sent to Discover (sign-in, sign-up). */
    guestOnly?: boolean;
    title?: string;
  }
}

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    name: 'discover',
    component: () => import('../views/discover/DiscoverView.vue'),
    meta: { title: 'Discover' },
  },
  {
    path: '/journals/mine',
    name: 'my-journals',
    component: () => import('../views/journals/MyJournalsView.vue'),
    meta: { requiresAuth: true, title: 'My journals' },
  },
  {
    path: '/journals/new',
    name: 'journal-new',
    component: () => import('../views/journals/JournalEditView.vue'),
    meta: { requiresAuth: true, title: 'New journal' },
  },
  {
    path: '/journals/:id(\\d+)/edit',
    name: 'journal-edit',
    component: () => import('../views/journals/JournalEditView.vue'),
    props: true,
    meta: { requiresAuth: true, title: 'Edit journal' },
  },
  {
    path: '/journals/:id(\\d+)',
    name: 'journal',
    component: () => import('../views/journals/JournalView.vue'),
    props: true,
    meta: { title: 'Journal' },
  },
  {
    // At the vat: the make-day view (step timers, readings, ramp, press) for the journal's maker.
    path: '/journals/:id(\\d+)/vat',
    name: 'vat',
    component: () => import('../views/vat/VatView.vue'),
    props: true,
    meta: { requiresAuth: true, title: 'At the vat' },
  },
  {
    // The scorecard; ?invite=CODE when a friend scores the maker's wheel, ?edit=ID to change one.
    path: '/journals/:id(\\d+)/taste',
    name: 'taste',
    component: () => import('../views/tastings/TastingFormView.vue'),
    props: true,
    meta: { requiresAuth: true, title: 'Score a wheel' },
  },
  {
    path: '/cave',
    name: 'cave',
    component: () => import('../views/cave/CaveView.vue'),
    meta: { requiresAuth: true, title: 'My cave' },
  },
  {
    path: '/compare',
    name: 'compare',
    component: () => import('../views/compare/CompareView.vue'),
    meta: { title: 'Compare' },
  },
  {
    // Two to four journals side by side: /compare/journals?ids=3,8
    path: '/compare/journals',
    name: 'compare-journals',
    component: () => import('../views/compare/CompareJournalsView.vue'),
    meta: { title: 'Journals side by side' },
  },
  {
    path: '/signin',
    name: 'sign-in',
    component: () => import('../views/account/SignInView.vue'),
    meta: { guestOnly: true, title: 'Sign in' },
  },
  {
    path: '/join',
    name: 'sign-up',
    component: () => import('../views/account/SignUpView.vue'),
    meta: { guestOnly: true, title: 'Join' },
  },
  {
    path: '/verify',
    name: 'verify-email',
    component: () => import('../views/account/VerifyView.vue'),
    meta: { title: 'Confirm your e-mail' },
  },
  {
    path: '/forgot',
    name: 'forgot-password',
    component: () => import('../views/account/ForgotPasswordView.vue'),
    meta: { guestOnly: true, title: 'Forgot password' },
  },
  {
    path: '/reset',
    name: 'reset-password',
    component: () => import('../views/account/ResetPasswordView.vue'),
    meta: { title: 'New password' },
  },
  {
    path: '/settings',
    name: 'settings',
    component: () => import('../views/account/SettingsView.vue'),
    meta: { requiresAuth: true, title: 'Account settings' },
  },
  {
    path: '/@:handle([a-z0-9_-]+)',
    name: 'profile',
    component: () => import('../views/members/ProfileView.vue'),
    props: true,
    meta: { title: 'Maker' },
  },
  {
    path: '/notifications',
    name: 'notifications',
    component: () => import('../views/members/NotificationsView.vue'),
    meta: { requiresAuth: true, title: 'Notifications' },
  },
  {
    path: '/admin',
    name: 'admin',
    component: () => import('../views/admin/AdminView.vue'),
    meta: { requiresAuth: true, roles: ['moderator', 'admin'], title: 'Admin' },
  },
  {
    path: '/safety',
    name: 'safety',
    component: () => import('../views/SafetyView.vue'),
    meta: { title: 'Safety notes' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('../views/NotFoundView.vue'),
    meta: { title: 'Not found' },
  },
];
