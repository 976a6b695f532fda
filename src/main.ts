import { createApp } from 'vue';
import { createPinia } from 'pinia';
import { Dark, Notify, Quasar } from 'quasar';
import '@quasar/extras/roboto-font/roboto-font.css';
import '@quasar/extras/material-icons/material-icons.css';
import 'quasar/src/css/index.sass';
import './css/app.scss';
import App from './App.vue';
import { createAppRouter } from './router';
import { installAuthBoot } from './boot/auth';
import { installConfirm } from './boot/confirm';
import { applyStoredDisplayLocale } from './composables/useDisplayLocale';

applyStoredDisplayLocale();

const app = createApp(App);
app.use(Quasar, { plugins: { Notify, Dark }, config: { dark: 'auto' } });
installConfirm(app);
app.use(createPinia());
const router = createAppRouter();
installAuthBoot(router);
app.use(router);
app.mount('#q-app');
