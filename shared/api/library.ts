/** The property library: buffers and wall materials. */
import type { Id } from './common';

export const LIBRARY_KINDS = ['buffer', 'wall'] as const;
export type LibraryKind = (typeof LIBRARY_KINDS)[number];

export interface BufferValues {
  relativePermittivity?: number;
  /** Pa s */
  viscosity?: number;
  /** kg/m^3 */
  density?: number;
  /** S/m */
  conductivity?: number;
  /** mol/m^3 */
  ionicStrength?: number;
  /** K */
  temperature?: number;
}

/** Wall materials: zeta (V) and electroosmotic mobility (m^2/(V s)), as a typical value and/or a range. */
export interface WallValues {
  zeta?: number;
  zetaMin?: number;
  zetaMax?: number;
  mobility?: number;
  mobilityMin?: number;
  mobilityMax?: number;
  /** Conditions the values hold for, or a caution. */
  note?: string;
}

export interface LibraryItem {
  id: Id;
  kind: LibraryKind;
  name: string;
  values: BufferValues | WallValues;
  source: string;
  /** Built-in entries come from the project's reference values and are read-only. */
  builtIn: boolean;
}

export interface LibraryItemRequest {
  kind: LibraryKind;
  name: string;
  values: BufferValues | WallValues;
  source?: string;
}
