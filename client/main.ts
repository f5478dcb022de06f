import '@fontsource/lora/700.css';
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import './styles/base.css';
import { createPinia } from 'pinia';
import { createApp } from 'vue';
import App from './App.vue';
import { fetchJournal } from './api/journals';
import { startEarly } from './api/early';
import { router } from './router';
import { useSessionStore } from './stores/session';

const pinia = createPinia();
// The session check goes out first (the router's guard waits for it), then the first route's
// chunk starts loading beside it, instead of after the guard has passed (vue-router loads a
// lazy component only then).
void useSessionStore(pinia).load();
const first = router.resolve(location.pathname + location.search);
// A journal page's journal is read beside them too (useJournal takes it).
if (first.name === 'journal') {
  const id = String(first.params.id);
  startEarly(`journal:${id}`, () => fetchJournal(id));
}
for (const record of first.matched) {
  for (const component of Object.values(record.components ?? {})) {
    if (typeof component === 'function' && !('__vccOpts' in component))
      void (component as () => Promise<unknown>)().catch(() => undefined); // the router retries
  }
}

const app = createApp(App);
app.use(pinia);
app.use(router);
app.mount('#app');
