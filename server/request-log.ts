import type { RequestHandler } from 'express';
import morgan from 'morgan';

/** Lines not yet written; they go out together once per turn of the event loop. */
let pending: string[] = [];

function flush(): void {
  if (!pending.length) return;
  const out = pending.join('');
  pending = [];
  process.stdout.write(out);
}

// Whatever is still gathered when the process ends (process.exit at shutdown) goes out first.
process.on('exit', flush);

/**
 * The request log: one line a request on stdout. Node writes to stdout synchronously on Linux (files, pipes and
 * terminals alike), so a write per request would stall every request under load; the lines of one turn of the
 * event loop go out in one write instead.
 */
export function requestLog(): RequestHandler {
  return morgan(':method :url :status :res[content-length] - :response-time ms', {
    stream: {
      write(line: string) {
        if (!pending.length) setImmediate(flush);
        pending.push(line);
      },
    },
  });
}
