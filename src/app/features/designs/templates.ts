import { DESIGN_FORMAT, type DesignDocument } from '../../../../shared/design';

/**
 * Starting layouts for "New design" (design-format.md, version 1; SI units). Channels are 50 µm wide and 20 µm
 * deep in a 10 mM aqueous buffer at 25 °C on glass-like walls (zeta −50 mV); every port sits on the outline.
 * The numbers are ordinary starting values, chosen here, not measurements.
 */
export interface DesignTemplate {
  id: 'blank' | 'straight' | 'cross' | 'tee' | 'expansion' | 'serpentine';
  label: string;
  description: string;
  document: DesignDocument;
}

const W = 50e-6; // channel width
const H = W / 2;

const base = (name: string): Omit<DesignDocument, 'shapes' | 'ports'> => ({
  format: DESIGN_FORMAT,
  name,
  depth: 20e-6,
  buffer: {
    relativePermittivity: 78.4,
    viscosity: 8.9e-4,
    density: 997,
    conductivity: 0.14,
    ionicStrength: 10,
    temperature: 298.15,
  },
  zeta: { side: -0.05, floor: -0.05, lid: -0.05 },
  wallZones: [],
});

const rect = (x: number, y: number, width: number, height: number) =>
  ({ op: 'add', type: 'rect', x, y, width, height, angle: 0 }) as const;

function blank(): DesignDocument {
  return { ...base('Blank layout'), shapes: [], ports: [] };
}

/** One 2 mm channel, driven end to end. */
function straight(): DesignDocument {
  return {
    ...base('Straight channel'),
    shapes: [rect(0, -H, 2e-3, W)],
    ports: [
      { id: 'A', name: 'inlet', from: [0, -H], to: [0, H], potential: 100, pressure: 0 },
      { id: 'B', name: 'outlet', from: [2e-3, -H], to: [2e-3, H], potential: 0, pressure: 0 },
    ],
  };
}

/** Two 2 mm channels crossing at the origin: sample across, buffer and waste along. */
function cross(): DesignDocument {
  const L = 1e-3;
  return {
    ...base('Cross injector'),
    shapes: [rect(-L, -H, 2 * L, W), rect(-H, -L, W, 2 * L)],
    ports: [
      { id: 'S', name: 'sample', from: [-L, -H], to: [-L, H], potential: 200, pressure: 0 },
      { id: 'SW', name: 'sample waste', from: [L, -H], to: [L, H], potential: 0, pressure: 0 },
      { id: 'B', name: 'buffer', from: [-H, L], to: [H, L], potential: 150, pressure: 0 },
      { id: 'W', name: 'waste', from: [-H, -L], to: [H, -L], potential: 50, pressure: 0 },
    ],
  };
}

/** A 2 mm main channel with a 1 mm side branch joining from above at its middle. */
function tee(): DesignDocument {
  const L = 2e-3;
  return {
    ...base('T junction'),
    shapes: [rect(0, -H, L, W), rect(L / 2 - H, -H, W, 1e-3 + H)],
    ports: [
      { id: 'A', name: 'left inlet', from: [0, -H], to: [0, H], potential: 100, pressure: 0 },
      { id: 'B', name: 'branch inlet', from: [L / 2 - H, 1e-3], to: [L / 2 + H, 1e-3], potential: 100, pressure: 0 },
      { id: 'C', name: 'outlet', from: [L, -H], to: [L, H], potential: 0, pressure: 0 },
    ],
  };
}

/** A 50 µm inlet opening into a 400 µm wide, 1 mm long chamber, then a 50 µm outlet. */
function expansion(): DesignDocument {
  const C = 200e-6; // half the chamber width
  return {
    ...base('Expansion chamber'),
    shapes: [rect(0, -H, 1.01e-3, W), rect(1e-3, -C, 1e-3, 2 * C), rect(1.99e-3, -H, 1.01e-3, W)],
    ports: [
      { id: 'IN', name: 'inlet', from: [0, -H], to: [0, H], potential: 150, pressure: 0 },
      { id: 'OUT', name: 'outlet', from: [3e-3, -H], to: [3e-3, H], potential: 0, pressure: 0 },
    ],
  };
}

/** Three 1.5 mm legs, 200 µm apart, joined by two half-turn bends (annular sectors, 100 µm centre radius). */
function serpentine(): DesignDocument {
  const L = 1.5e-3;
  const pitch = 200e-6;
  const rMid = pitch / 2;
  return {
    ...base('Serpentine channel'),
    shapes: [
      rect(0, -H, L, W),
      { op: 'add', type: 'sector', center: [L, rMid], innerRadius: rMid - H, outerRadius: rMid + H, startAngle: -90, endAngle: 90 },
      rect(0, pitch - H, L, W),
      { op: 'add', type: 'sector', center: [0, pitch + rMid], innerRadius: rMid - H, outerRadius: rMid + H, startAngle: 90, endAngle: 270 },
      rect(0, 2 * pitch - H, L, W),
    ],
    ports: [
      { id: 'IN', name: 'inlet', from: [0, -H], to: [0, H], potential: 300, pressure: 0 },
      { id: 'OUT', name: 'outlet', from: [L, 2 * pitch - H], to: [L, 2 * pitch + H], potential: 0, pressure: 0 },
    ],
  };
}

export const DESIGN_TEMPLATES: readonly DesignTemplate[] = [
  { id: 'blank', label: 'Blank', description: 'No shapes yet; buffer and walls preset', document: blank() },
  { id: 'straight', label: 'Straight channel', description: '2 mm × 50 µm, two ports', document: straight() },
  { id: 'cross', label: 'Cross', description: 'Two 2 mm legs crossing, four ports', document: cross() },
  { id: 'tee', label: 'T junction', description: 'Main channel with a side branch, three ports', document: tee() },
  { id: 'expansion', label: 'Expansion', description: '50 µm into a 400 µm chamber and out', document: expansion() },
  { id: 'serpentine', label: 'Serpentine', description: 'Three legs joined by two bends', document: serpentine() },
];

/** A fresh copy of a template's document, renamed. */
export function documentFrom(template: DesignTemplate, name: string): DesignDocument {
  const doc = JSON.parse(JSON.stringify(template.document)) as DesignDocument;
  doc.name = name;
  return doc;
}
