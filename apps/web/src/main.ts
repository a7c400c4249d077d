import '@fontsource/noto-sans/400.css';
import '@fontsource/noto-sans/500.css';
import '@fontsource/noto-sans/600.css';
import 'ant-design-vue/dist/reset.css';
import './styles/base.css';
import { abilitiesPlugin } from '@casl/vue';
import { createPinia } from 'pinia';
import { createApp } from 'vue';
import App from './App.vue';
import { setUnauthenticatedHandler } from './api/client.ts';
import { router } from './router.ts';
import { ability, useSessionStore } from './stores/session.ts';
import { applyThemeVariables } from './theme.ts';

applyThemeVariables(document.documentElement);

const app = createApp(App).use(createPinia());
const session = useSessionStore();

// A session that ends while the app is open (expired, signed out elsewhere) sends the person to sign in again.
setUnauthenticatedHandler((path) => {
  if (path === '/session' || !session.person) return;
  session.forget();
  const here = router.currentRoute.value;
  void router.replace({ name: 'sign-in', query: { next: here.fullPath } });
});

app.use(router).use(abilitiesPlugin, ability).mount('#app');
