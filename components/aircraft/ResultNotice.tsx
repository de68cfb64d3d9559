// Moved to components/ui/ResultNotice.tsx; kept while the aircraft and departure forms import this path.
export * from '@/components/ui/ResultNotice';
