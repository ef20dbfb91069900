import type { RouteRecordRaw } from 'vue-router';

/** Every named route of the app; `routerPush` and `appRoute` accept only these. */
export const ROUTE_NAMES = [
  'sign-in',
  'sign-up',
  'reset-password',
  'verify-email',
  'unsubscribe',
  'home',
  'profile',
  'admin-users',
  'admin-audit',
  'admin-catalogue',
  'admin-centers',
  'arsenal',
  'ball',
  'catalogue',
  'matchup',
  'patterns',
  'pattern-new',
  'pattern-edit',
  'conditions',
  'center-condition',
  'center-admin',
  'sessions',
  'session',
  'leagues',
  'stats',
  'coach',
  'decisions',
  'trial',
  'orders',
  'order',
  'dev-mail',
  'forbidden',
  'not-found',
] as const;
export type AppRouteName = (typeof ROUTE_NAMES)[number];

type AppRouteRecord = RouteRecordRaw & { name?: AppRouteName; children?: AppRouteRecord[] };

/** Route table. Views are lazy-loaded; role rules live in `meta.roles` and are enforced by the guard. */
export const routes: AppRouteRecord[] = [
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/views/SignInView.vue'),
    meta: { title: 'Sign in', public: true, guestOnly: true },
  },
  {
    path: '/sign-up',
    name: 'sign-up',
    component: () => import('@/views/SignUpView.vue'),
    meta: { title: 'Create an account', public: true, guestOnly: true },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('@/views/ResetPasswordView.vue'),
    meta: { title: 'Reset password', public: true },
  },
  {
    path: '/verify-email',
    name: 'verify-email',
    component: () => import('@/views/VerifyEmailView.vue'),
    meta: { title: 'Confirm your e-mail', public: true },
  },
  {
    // The unsubscribe link of a follower e-mail: asks before it stops anything.
    path: '/unsubscribe',
    name: 'unsubscribe',
    component: () => import('@/views/UnsubscribeView.vue'),
    meta: { title: 'Condition e-mails', public: true },
  },
  {
    path: '/',
    component: () => import('@/components/AppLayout.vue'),
    children: [
      { path: '', name: 'home', component: () => import('@/views/HomeView.vue'), meta: { title: 'Home' } },
      { path: 'profile', name: 'profile', component: () => import('@/views/ProfileView.vue'), meta: { title: 'Profile' } },
      { path: 'arsenal', name: 'arsenal', component: () => import('@/views/ArsenalView.vue'), meta: { title: 'Arsenal' } },
      { path: 'arsenal/:id(\\d+)', name: 'ball', component: () => import('@/views/BallView.vue'), meta: { title: 'Ball' } },
      { path: 'catalogue', name: 'catalogue', component: () => import('@/views/CatalogueView.vue'), meta: { title: 'Catalogue' } },
      { path: 'matchup', name: 'matchup', component: () => import('@/views/MatchupView.vue'), meta: { title: 'Matchup' } },
      { path: 'patterns', name: 'patterns', component: () => import('@/views/PatternsView.vue'), meta: { title: 'Patterns' } },
      {
        path: 'patterns/new',
        name: 'pattern-new',
        component: () => import('@/views/PatternEditorView.vue'),
        meta: { title: 'New pattern', roles: ['coach', 'proprietor', 'admin'] },
      },
      {
        path: 'patterns/:id(\\d+)/edit',
        name: 'pattern-edit',
        component: () => import('@/views/PatternEditorView.vue'),
        meta: { title: 'Edit pattern', roles: ['coach', 'proprietor', 'admin'] },
      },
      { path: 'conditions', name: 'conditions', component: () => import('@/views/ConditionsView.vue'), meta: { title: 'Conditions' } },
      {
        // Public: a center's published condition is meant to be shared, no sign-in needed.
        path: 'centers/:id(\\d+)/condition',
        name: 'center-condition',
        component: () => import('@/views/ConditionPublicView.vue'),
        meta: { title: 'Lane condition', public: true },
      },
      {
        path: 'center-admin',
        name: 'center-admin',
        component: () => import('@/views/CenterAdminView.vue'),
        meta: { title: 'Center admin', roles: ['proprietor', 'admin'] },
      },
      { path: 'orders', name: 'orders', component: () => import('@/views/OrdersView.vue'), meta: { title: 'My orders' } },
      { path: 'orders/:id(\\d+)', name: 'order', component: () => import('@/views/OrderView.vue'), meta: { title: 'Order' } },
      { path: 'sessions', name: 'sessions', component: () => import('@/views/SessionsView.vue'), meta: { title: 'Sessions' } },
      { path: 'sessions/:id(\\d+)', name: 'session', component: () => import('@/views/SessionView.vue'), meta: { title: 'Session' } },
      { path: 'leagues', name: 'leagues', component: () => import('@/views/LeaguesView.vue'), meta: { title: 'Leagues' } },
      { path: 'stats', name: 'stats', component: () => import('@/views/StatsView.vue'), meta: { title: 'Stats' } },
      // Coaches and admins see their students; every bowler sees their coaches and invitations here.
      { path: 'coach', name: 'coach', component: () => import('@/views/CoachView.vue'), meta: { title: 'Coach' } },
      // Equipment trials, the layout lab and arsenal coverage (tab in ?tab=).
      { path: 'decide', name: 'decisions', component: () => import('@/views/DecisionsView.vue'), meta: { title: 'Decide' } },
      { path: 'decide/trials/:id(\\d+)', name: 'trial', component: () => import('@/views/TrialView.vue'), meta: { title: 'Trial' } },
      {
        // Development and tests only, for the admin: the page says so when the API has no mailbox (production).
        path: 'dev/mail',
        name: 'dev-mail',
        component: () => import('@/views/DevMailView.vue'),
        meta: { title: 'Dev mailbox', roles: ['admin'] },
      },
      {
        path: 'admin/users',
        name: 'admin-users',
        component: () => import('@/views/AdminUsersView.vue'),
        meta: { title: 'Users and roles', roles: ['admin'] },
      },
      {
        path: 'admin/audit',
        name: 'admin-audit',
        component: () => import('@/views/AdminAuditView.vue'),
        meta: { title: 'Audit log', roles: ['admin'] },
      },
      {
        path: 'admin/catalogue',
        name: 'admin-catalogue',
        component: () => import('@/views/AdminCatalogueView.vue'),
        meta: { title: 'Catalogue admin', roles: ['admin'] },
      },
      {
        path: 'admin/centers',
        name: 'admin-centers',
        component: () => import('@/views/AdminCentersView.vue'),
        meta: { title: 'Centers and proprietors', roles: ['admin'] },
      },
      {
        path: 'forbidden',
        name: 'forbidden',
        component: () => import('@/views/ForbiddenView.vue'),
        meta: { title: 'Not allowed' },
      },
      {
        path: ':pathMatch(.*)*',
        name: 'not-found',
        component: () => import('@/views/NotFoundView.vue'),
        meta: { title: 'Page not found', public: true },
      },
    ],
  },
];
