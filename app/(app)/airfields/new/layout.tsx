// Managers only (airfields:edit): the shared check in app/(app)/airfields/manager-only.tsx.
export { default } from '@/app/(app)/airfields/manager-only';
