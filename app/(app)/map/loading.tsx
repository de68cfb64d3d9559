export default function Loading() {
  return (
    <div aria-busy="true" aria-label="Loading the Site map" className="animate-pulse space-y-4">
      <div className="h-8 w-40 rounded-lg bg-slate-200 dark:bg-slate-800" />
      <div className="h-[60dvh] min-h-80 rounded-2xl bg-ice-100 dark:bg-slate-800 lg:h-[34rem]" />
      <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        <div className="h-28 rounded-2xl bg-slate-200 dark:bg-slate-800" />
        <div className="h-28 rounded-2xl bg-slate-200 dark:bg-slate-800" />
        <div className="h-28 rounded-2xl bg-slate-200 dark:bg-slate-800" />
      </div>
    </div>
  );
}
