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
    path: '/designs',
    name: 'designs',
    component: () => import('@/pages/DesignsPage.vue'),
    meta: { title: 'Designs' },
  },
  {
    path: '/designs/:id(\\d+)',
    name: 'design',
    component: () => import('@/pages/DesignPage.vue'),
    props: true,
    meta: { title: 'Design' },
  },
  {
    path: '/revisions/:id(\\d+)',
    name: 'revision',
    component: () => import('@/pages/RevisionEditorPage.vue'),
    props: true,
    meta: { title: 'Revision', wide: true },
  },
  {
    path: '/revisions/:id(\\d+)/study',
    name: 'study',
    component: () => import('@/pages/StudyPage.vue'),
    props: true,
    meta: { title: 'Uncertainty study', wide: true },
  },
  {
    path: '/stock',
    name: 'stock',
    component: () => import('@/pages/StockPage.vue'),
    meta: { title: 'Stock', wide: true },
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
