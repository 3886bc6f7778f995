import '@fontsource/merriweather-sans/400.css';
import '@fontsource/merriweather-sans/700.css';
import 'primeicons/primeicons.css';
import './assets/main.css';
import { createPinia } from 'pinia';
import PrimeVue from 'primevue/config';
import ConfirmationService from 'primevue/confirmationservice';
import ToastService from 'primevue/toastservice';
import Tooltip from 'primevue/tooltip';
import { createApp } from 'vue';
import App from './App.vue';
import { router } from './router';
import { ByrecastPreset } from './theme';
import './primevue-styles';

if (localStorage.getItem('byrecast-theme') === 'dark') document.documentElement.classList.add('dark');

const app = createApp(App);
app.use(createPinia());
app.use(router);
app.use(PrimeVue, { theme: { preset: ByrecastPreset, options: { darkModeSelector: '.dark', cssLayer: false } } });
app.use(ToastService);
app.use(ConfirmationService);
app.directive('tooltip', Tooltip);
app.mount('#app');
