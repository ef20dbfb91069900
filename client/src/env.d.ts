/// <reference types="vite/client" />
/// <reference types="element-plus/global" />
/// <reference types="vite-plugin-pwa/client" />

import 'vue-router';
import type { Role } from '@shared/auth';

declare module 'vue-router' {
  interface RouteMeta {
    /** Page title, also announced to screen readers on navigation. */
    title?: string;
    /** Reachable without signing in. */
    public?: boolean;
    /** Only for visitors who are not signed in (sign-in, sign-up); signed-in users go home. */
    guestOnly?: boolean;
    /** Roles allowed to open the page; absent = any signed-in user. */
    roles?: readonly Role[];
  }
}

export {};
