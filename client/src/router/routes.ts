import type { RouteRecordRaw } from 'vue-router';

/** Every named route of the app; `routerPush` and `appRoute` accept only these. */
export const ROUTE_NAMES = [
  'sign-in',
  'sign-up',
  'reset-password',
  'home',
  'profile',
  'admin-users',
  'arsenal',
  'ball',
  'catalogue',
  'matchup',
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
    path: '/',
    component: () => import('@/components/AppLayout.vue'),
    children: [
      { path: '', name: 'home', component: () => import('@/views/HomeView.vue'), meta: { title: 'Home' } },
      { path: 'profile', name: 'profile', component: () => import('@/views/ProfileView.vue'), meta: { title: 'Profile' } },
      { path: 'arsenal', name: 'arsenal', component: () => import('@/views/ArsenalView.vue'), meta: { title: 'Arsenal' } },
      { path: 'arsenal/:id(\\d+)', name: 'ball', component: () => import('@/views/BallView.vue'), meta: { title: 'Ball' } },
      { path: 'catalogue', name: 'catalogue', component: () => import('@/views/CatalogueView.vue'), meta: { title: 'Catalogue' } },
      { path: 'matchup', name: 'matchup', component: () => import('@/views/MatchupView.vue'), meta: { title: 'Matchup' } },
      {
        path: 'admin/users',
        name: 'admin-users',
        component: () => import('@/views/AdminUsersView.vue'),
        meta: { title: 'Users and roles', roles: ['admin'] },
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
