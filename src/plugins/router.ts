export { router } from '@/router';
