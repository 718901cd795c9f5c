import { wrap } from 'comlink';
import type { InstantApi } from './instant-api';

/**
 * The app's instant worker, started at once (it is small). Kept in its own file: `import.meta` and `Worker`
 * exist only in the browser build.
 */
export function createInstantWorker(): InstantApi {
  return wrap<InstantApi>(new Worker(new URL('./instant.worker', import.meta.url), { type: 'module' })) as unknown as InstantApi;
}
