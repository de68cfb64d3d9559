export default function Loading() {
  return (
    <div aria-busy="true" aria-label="Loading" className="animate-pulse space-y-4">
      <div className="h-8 w-48 rounded-lg bg-slate-200 dark:bg-slate-800" />
      <div className="h-24 rounded-2xl bg-slate-200 dark:bg-slate-800" />
      <div className="h-24 rounded-2xl bg-slate-200 dark:bg-slate-800" />
    </div>
  );
}
