// Before any schema is made (see zod-jitless.ts).
import './zod-jitless.ts';
import '@fontsource/noto-sans/latin-400.css';
import '@fontsource/noto-sans/latin-500.css';
import '@fontsource/noto-sans/latin-600.css';
import '@fontsource/noto-sans/latin-700.css';
// Function-API components (ElMessage, ElMessageBox) are not seen by the resolver.
import 'element-plus/es/components/message/style/css';
import 'element-plus/es/components/message-box/style/css';
import 'element-plus/theme-chalk/el-var.css';
import './styles/tokens.css';
import './styles/element.css';
import './styles/base.css';

import { abilitiesPlugin } from '@casl/vue';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { createPinia } from 'pinia';
import { createApp } from 'vue';
import { ability } from './ability.ts';
import { queryClient } from './api/queryClient.ts';
import App from './App.vue';
import { router } from './router/index.ts';
import { keepReadsOnceControlled, registerWhenSettled } from './utils/offlineCache.ts';

const app = createApp(App);
app.use(createPinia());
app.use(router);
app.use(VueQueryPlugin, { queryClient });
app.use(abilitiesPlugin, ability, { useGlobalProperties: true });
app.mount('#app');
keepReadsOnceControlled();
registerWhenSettled(() => queryClient.isFetching() > 0 || !router.currentRoute.value.matched.length);
