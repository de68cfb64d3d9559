// Next.js calls register() once when a server process starts. The background work (local mail capture
// and the job scheduler) runs only in the Node.js runtime of a real server: not in the edge runtime,
// not while `next build` prerenders, and not with THAWLINE_JOBS=off.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  await stampPeerAddress();
  if (process.env.THAWLINE_JOBS === 'off') return;
  if (process.env.NEXT_PHASE === 'phase-production-build') return;
  const { startBackground } = await import('./lib/jobs');
  await startBackground().catch(() => {
    // Logged by startBackground; the app still serves pages without background jobs.
  });
}

/**
 * Route handlers see headers, not the socket. Every HTTP request this process serves gets its
 * connection's address in a header of our own, overwriting any value the client sent (see
 * lib/auth/client-address.ts for why X-Forwarded-For cannot serve).
 */
async function stampPeerAddress() {
  const http = await import('node:http');
  const { PEER_HEADER, markPeerStamped } = await import('./lib/auth/client-address');
  const proto = http.Server.prototype as unknown as { emit: (event: string, ...args: unknown[]) => boolean; __thawlineStamped?: boolean };
  if (!proto.__thawlineStamped) {
    const emit = proto.emit;
    proto.emit = function (this: unknown, event: string, ...args: unknown[]) {
      if (event === 'request') {
        const req = args[0] as import('node:http').IncomingMessage;
        req.headers[PEER_HEADER] = req.socket?.remoteAddress ?? '';
      }
      return emit.call(this, event, ...args);
    };
    proto.__thawlineStamped = true;
  }
  markPeerStamped();
}
