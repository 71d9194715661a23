import { createApp } from 'vue';
import App from './App.vue';
import { installFonts } from './plugins/fonts';
import { pinia } from './plugins/pinia';
import { primeVue } from './plugins/primevue';
import { router } from './plugins/router';
import { sessionExpiry } from './plugins/sessionExpiry';

installFonts();

// Pinia before the router: the route guard reads the session store.
createApp(App).use(pinia).use(primeVue).use(router).use(sessionExpiry).mount('#app');
