// Moved to lib/defaults.ts (pure: forms, validation and the data layer read it too); kept while
// lib/data/aircraft.ts still imports this path.
export * from '@/lib/defaults';
