/**
 * The polygon-clipping package, reached the same way under CommonJS (tests,
 * command line) and ES modules (the browser worker, whose build only sees a
 * default export).
 */
import * as clippingModule from 'polygon-clipping';

type Clipping = typeof clippingModule;
const withDefault = clippingModule as unknown as { default?: Clipping };

export const clipping: Clipping = withDefault.default ?? clippingModule;
export type { MultiPolygon, Polygon as ClipPolygon } from 'polygon-clipping';
