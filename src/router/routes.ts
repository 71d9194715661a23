import type { RouteRecordRaw } from 'vue-router';
import SignInPage from '@/pages/SignInPage.vue';

export const routes: RouteRecordRaw[] = [
  {
    path: '/sign-in',
    name: 'sign-in',
    component: SignInPage,
    meta: { title: 'Sign in', public: true, bare: true },
  },
  {
    path: '/invite/:token',
    name: 'accept-invite',
    component: () => import('@/pages/AcceptInvitePage.vue'),
    props: true,
    meta: { title: 'Accept invitation', public: true, bare: true },
  },
  {
    path: '/',
    name: 'home',
    component: () => import('@/pages/HomePage.vue'),
    meta: { title: 'Home' },
  },
  {
    path: '/people',
    name: 'people',
    component: () => import('@/pages/UsersPage.vue'),
    meta: { title: 'People', roles: ['admin'], area: 'People' },
  },
  {
    path: '/outbox',
    name: 'outbox',
    component: () => import('@/pages/OutboxPage.vue'),
    meta: { title: 'Outbox', roles: ['admin'], area: 'Outbox' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/pages/NotFoundPage.vue'),
    meta: { title: 'Not found', public: true },
  },
];
