/** The four port roles of a cross injector, and their guess from the ports' ids and names (the Tracer's pinched plug). */
import type { DesignDocument } from './design';

/** The four reservoirs of a cross injector. */
export interface CrossRoles {
  sample: string;
  sampleWaste: string;
  buffer: string;
  waste: string;
}

/** Ports named or labelled as a cross injector's (S, SW, B, W or sample, sample waste, buffer, waste). */
export function guessCrossRoles(design: Pick<DesignDocument, 'ports'>): CrossRoles | null {
  const find = (id: string, name: RegExp) =>
    design.ports.find((p) => p.id.toUpperCase() === id) ?? design.ports.find((p) => name.test((p.name ?? '').trim()));
  const sample = find('S', /^sample$/i);
  const sampleWaste = find('SW', /^sample[ -]?waste$/i);
  const buffer = find('B', /^(run(ning)? )?buffer$/i);
  const waste = find('W', /^(buffer )?waste$/i);
  if (!sample || !sampleWaste || !buffer || !waste) return null;
  const ids = [sample.id, sampleWaste.id, buffer.id, waste.id];
  if (new Set(ids).size < 4) return null;
  return { sample: sample.id, sampleWaste: sampleWaste.id, buffer: buffer.id, waste: waste.id };
}
