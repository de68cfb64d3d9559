import 'server-only';
import { TooLarge } from '@/lib/api/errors';
import { MAX_LOG_BYTES } from '@/lib/fit/csv';

/**
 * The request body as a stream of byte chunks for the CSV reader (which counts bytes and stops at the
 * limit). A declared length over the limit is refused before anything is read.
 */
export const LOG_TOO_LARGE = `The file is larger than the ${MAX_LOG_BYTES / 1024 / 1024} MB limit. Split the log or export only the cool-down.`;

export function uploadStream(req: Request): AsyncIterable<Uint8Array> {
  const declared = Number(req.headers.get('content-length') ?? 0);
  if (declared > MAX_LOG_BYTES) throw new TooLarge(LOG_TOO_LARGE);
  const body = req.body;
  return {
    async *[Symbol.asyncIterator]() {
      if (!body) return;
      const reader = body.getReader();
      try {
        for (;;) {
          const { done, value } = await reader.read();
          if (done) return;
          if (value?.byteLength) yield value;
        }
      } finally {
        reader.releaseLock();
      }
    },
  };
}
