import { createRouter, createWebHistory } from 'vue-router';
import { routes } from './routes';
import { sessionGuard } from './guard';

export const router = createRouter({
  history: createWebHistory(import.meta.env.BASE_URL),
  routes,
  scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
});

router.beforeEach(sessionGuard);

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Tallyvolt` : 'Tallyvolt';
});
