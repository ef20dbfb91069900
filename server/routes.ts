import { adminRoutes } from './features/admin/admin.routes';
import { arsenalRoutes } from './features/arsenal/arsenal.routes';
import { authRoutes } from './features/auth/auth.routes';
import { catalogueRoutes } from './features/catalogue/catalogue.routes';
import { centersRoutes, followsRoutes, unsubscribeRoutes } from './features/centers/centers.routes';
import { coachRoutes, plansRoutes } from './features/coaching/coaching.routes';
import { coverageRoutes, layoutLabRoutes, trialsRoutes } from './features/decisions/decisions.routes';
import { docsRoutes } from './features/docs/docs.routes';
import { healthRoutes } from './features/health/health.routes';
import { leaguesRoutes } from './features/leagues/leagues.routes';
import { upkeepRoutes } from './features/upkeep/upkeep.routes';
import { matchupsRoutes } from './features/matchups/matchups.routes';
import { patternsRoutes } from './features/patterns/patterns.routes';
import { profileRoutes } from './features/profile/profile.routes';
import { sessionsRoutes } from './features/sessions/sessions.routes';
import { paymentsRoutes } from './features/shop/payments.routes';
import { ordersRoutes, shopCenterRoutes } from './features/shop/shop.routes';
import { calibrationRoutes, statsRoutes } from './features/stats/stats.routes';
import type { RouteGroup } from './http/route';

/**
 * The route table: every endpoint of the API, by feature, in the order Express matches them. app.ts registers
 * it, the docs generate the OpenAPI document from it, the access-matrix test reads it. The development tools
 * (`features/dev/dev.routes.ts`) are added by app.ts outside production only.
 */
export const ROUTE_TABLE: readonly RouteGroup[] = [
  paymentsRoutes,
  healthRoutes,
  authRoutes,
  profileRoutes,
  adminRoutes,
  catalogueRoutes,
  arsenalRoutes,
  patternsRoutes,
  matchupsRoutes,
  centersRoutes,
  shopCenterRoutes,
  ordersRoutes,
  followsRoutes,
  sessionsRoutes,
  leaguesRoutes,
  upkeepRoutes,
  statsRoutes,
  calibrationRoutes,
  coachRoutes,
  plansRoutes,
  trialsRoutes,
  coverageRoutes,
  layoutLabRoutes,
  unsubscribeRoutes,
  docsRoutes(() => ROUTE_TABLE),
];
