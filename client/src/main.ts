import { createApp } from 'vue';
import { createPinia } from 'pinia';
import { VueQueryPlugin } from '@tanstack/vue-query';
import 'element-plus/theme-chalk/base.css';
// Services called from script (not templates) bring their own styles.
import 'element-plus/es/components/message-box/style/css';
import 'element-plus/es/components/notification/style/css';
import 'element-plus/es/components/message/style/css';
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import './styles/theme.css';
import './styles/base.css';

import App from './App.vue';
import { configureApiClient } from './api/client';
import { queryClient } from './api/queries';
import { router, routerReplace } from './router';
import { useAuthStore } from './stores/auth';
import { guardUserData } from './stores/userData';
import { startAppUpdates } from './composables/useAppUpdate';

const app = createApp(App);
const pinia = createPinia();
app.use(pinia);

const auth = useAuthStore(pinia);
app.use(VueQueryPlugin, { queryClient });
guardUserData(pinia);

// The one 401 policy: any 401 from any route ends the session and returns to sign-in,
// remembering the page to come back to.
configureApiClient({
  getToken: () => auth.token,
  onUnauthorized: () => {
    const current = router.currentRoute.value;
    auth.clearSession();
    if (!current.meta.public) {
      void routerReplace('sign-in', { query: { redirect: current.fullPath, reason: 'expired' } });
    }
  },
  // A write changed something on the server: cached lists refetch when next shown.
  onWrite: () => void queryClient.invalidateQueries(),
});

app.use(router);
app.mount('#app');
// The installable app's service worker: the shell opens with no connection; a new version is offered, never forced.
startAppUpdates();
