/**
 * The drives of a chip and their strengths: which port potentials and pressures move it, read from a design
 * document and written back into one. Plain document code, shared by the solver's planner and sweeps and by the
 * app (the Planner's settings and "Apply to conditions").
 */
import type { DesignDocument } from './design';

/** One independent drive of the chip: a port's electrode potential or its pressure. */
export interface Drive {
  port: string;
  kind: 'potential' | 'pressure';
}

/** Drives of a design: every port with an electrode (potential not null), plus every port's pressure when asked. */
export function drivesOf(design: DesignDocument, withPressures: boolean): Drive[] {
  const drives: Drive[] = design.ports.filter((p) => p.potential !== null).map((p) => ({ port: p.id, kind: 'potential' as const }));
  if (withPressures) for (const p of design.ports) drives.push({ port: p.id, kind: 'pressure' });
  return drives;
}

/** The strength of each drive in a design as it stands (its port potential or pressure). */
export function settingsOf(design: DesignDocument, drives: ReadonlyArray<Drive>): number[] {
  return drives.map((d) => {
    const port = design.ports.find((p) => p.id === d.port);
    if (!port) return 0;
    return d.kind === 'potential' ? (port.potential ?? 0) : (port.pressure ?? 0);
  });
}

/** The design with drive strengths written into its ports. */
export function withSettings(design: DesignDocument, drives: ReadonlyArray<Drive>, settings: ReadonlyArray<number>): DesignDocument {
  return {
    ...design,
    ports: design.ports.map((p) => {
      const port = { ...p };
      drives.forEach((d, k) => {
        if (d.port !== p.id) return;
        if (d.kind === 'potential') port.potential = settings[k];
        else port.pressure = settings[k];
      });
      return port;
    }),
  };
}
