import type { App, Plugin } from 'vue';
import PrimeVue from 'primevue/config';
import ConfirmationService from 'primevue/confirmationservice';
import { tallyvoltPreset } from '@/theme/preset';

export const primeVue: Plugin = {
  install(app: App) {
    app.use(PrimeVue, {
      theme: {
        preset: tallyvoltPreset,
        options: {
          prefix: 'p',
          // No dark scheme yet: a class nobody sets keeps the OS setting from half-applying one.
          darkModeSelector: '.tallyvolt-dark',
          cssLayer: false,
        },
      },
      ripple: false,
    });
    app.use(ConfirmationService);
  },
};
