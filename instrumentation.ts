// Next.js calls register() once when a server process starts. The background work (local mail capture
// and the job scheduler) runs only in the Node.js runtime of a real server: not in the edge runtime,
// not while `next build` prerenders, and not with THAWLINE_JOBS=off.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  if (process.env.THAWLINE_JOBS === 'off') return;
  if (process.env.NEXT_PHASE === 'phase-production-build') return;
  const { startBackground } = await import('./lib/jobs');
  await startBackground().catch(() => {
    // Logged by startBackground; the app still serves pages without background jobs.
  });
}
