// Moved to components/ui/sortable.tsx; kept while components outside airfields still import this path.
export * from '@/components/ui/sortable';
