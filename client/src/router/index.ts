import { createRouter, createWebHistory, type LocationQueryRaw, type RouteLocationNamedRaw, type RouteParamsRawGeneric } from 'vue-router';
import { useAuthStore } from '@/stores/auth';
import { routes, type AppRouteName } from './routes';

export type { AppRouteName } from './routes';

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
});

export interface AppRouteOptions {
  params?: RouteParamsRawGeneric;
  query?: LocationQueryRaw;
}

/** A typed location for `<RouterLink :to>`. */
export function appRoute(name: AppRouteName, options: AppRouteOptions = {}): RouteLocationNamedRaw {
  return { name, params: options.params, query: options.query };
}

/** Typed navigation: only known route names compile. */
export function routerPush(name: AppRouteName, options?: AppRouteOptions): ReturnType<typeof router.push> {
  return router.push(appRoute(name, options));
}

export function routerReplace(name: AppRouteName, options?: AppRouteOptions): ReturnType<typeof router.replace> {
  return router.replace(appRoute(name, options));
}

/** Accept only same-site paths as a post-sign-in destination. */
export function safeRedirect(value: unknown): string | null {
  if (typeof value !== 'string') return null;
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return null;
  return value;
}

router.beforeEach(async (to) => {
  const auth = useAuthStore();
  await auth.ensureSession();

  if (to.meta.guestOnly && auth.isSignedIn) return appRoute('home');
  if (to.meta.public) return true;
  if (!auth.isSignedIn) return appRoute('sign-in', { query: { redirect: to.fullPath } });
  if (!auth.hasRole(to.meta.roles)) return appRoute('forbidden', { query: { from: to.fullPath } });
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Lanewright` : 'Lanewright';
});
