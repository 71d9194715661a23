import type { RouteParamsGeneric, RouteParamsRawGeneric, RouteRecordInfo } from 'vue-router';
import SignInPage from '@/pages/SignInPage.vue';

// Typed by inference (the router checks them as route records) so the names below come from this one list.
export const routes = [
  {
    path: '/sign-in',
    name: 'sign-in',
    component: SignInPage,
    meta: { title: 'Sign in', public: true, bare: true },
  },
  {
    path: '/reset-password',
    name: 'reset-password-request',
    component: () => import('@/pages/PasswordResetRequestPage.vue'),
    meta: { title: 'Forgotten password', public: true, bare: true },
  },
  {
    path: '/reset-password/:token',
    name: 'reset-password',
    component: () => import('@/pages/PasswordResetPage.vue'),
    props: true,
    meta: { title: 'Set a new password', public: true, bare: true },
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
    path: '/revisions/:id(\\d+)/margin',
    name: 'margin',
    component: () => import('@/pages/MarginStudyPage.vue'),
    props: true,
    meta: { title: 'Margin study', wide: true },
  },
  {
    path: '/revisions/:id(\\d+)/review',
    name: 'review',
    component: () => import('@/pages/RevisionReviewPage.vue'),
    props: true,
    meta: { title: 'Review', wide: true },
  },
  {
    path: '/revisions/:id(\\d+)/report',
    name: 'report',
    component: () => import('@/pages/RevisionReportPage.vue'),
    props: true,
    meta: { title: 'Review report' },
  },
  {
    path: '/reviews',
    name: 'reviews',
    component: () => import('@/pages/ReviewsPage.vue'),
    meta: { title: 'Reviews', wide: true },
  },
  {
    path: '/stock',
    name: 'stock',
    component: () => import('@/pages/StockPage.vue'),
    meta: { title: 'Stock', wide: true },
  },
  {
    path: '/stock/series',
    name: 'series',
    component: () => import('@/pages/SeriesPage.vue'),
    meta: { title: 'Series', wide: true },
  },
  {
    path: '/boards',
    name: 'boards',
    component: () => import('@/pages/BoardsPage.vue'),
    meta: { title: 'Boards', wide: true },
  },
  {
    path: '/boards/:id(\\d+)',
    name: 'board',
    component: () => import('@/pages/BoardPage.vue'),
    props: true,
    meta: { title: 'Board' },
  },
  {
    path: '/calibrations/:id(\\d+)',
    name: 'calibration',
    component: () => import('@/pages/CalibrationSessionPage.vue'),
    props: true,
    meta: { title: 'Calibration session', wide: true },
  },
  {
    path: '/people',
    name: 'people',
    component: () => import('@/pages/UsersPage.vue'),
    meta: { title: 'People', may: 'administrators', area: 'People' },
  },
  {
    path: '/outbox',
    name: 'outbox',
    component: () => import('@/pages/OutboxPage.vue'),
    meta: { title: 'Outbox', may: 'administrators', area: 'Outbox' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/pages/NotFoundPage.vue'),
    meta: { title: 'Not found', public: true },
  },
] as const;

/** Every route's name; a push or link to a name not in this list fails the type check. */
export type RouteName = (typeof routes)[number]['name'];

declare module 'vue-router' {
  interface TypesConfig {
    RouteNamedMap: { [N in RouteName]: RouteRecordInfo<N, string, RouteParamsRawGeneric, RouteParamsGeneric> };
  }
}
