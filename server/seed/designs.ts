import { DESIGN_FORMAT, type DesignInput } from '../../shared/design';

/**
 * The four demo designs of product.md, as design documents (osmolane.design/1, SI units). All values are invented
 * for the demo but typical of glass chips: 20 um deep, a 10 mM aqueous buffer at 25 °C, zeta -50 mV, a few
 * hundred volts to 1 kV on the reservoirs.
 */

/** Lengths by division, so that 20 um prints as 0.00002 rather than 0.000019999999999999998. */
const um = (n: number) => n / 1e6;
const mm = (n: number) => n / 1e3;

/** Water-based 10 mM buffer at 25 °C (permittivity 78.3, viscosity 0.890 mPa s, density 997 kg/m^3). */
const buffer = {
  relativePermittivity: 78.3,
  viscosity: 8.9002e-4,
  density: 997.047,
  conductivity: 0.1413,
  ionicStrength: 10,
  temperature: 298.15,
};

const base = { format: DESIGN_FORMAT as typeof DESIGN_FORMAT, depth: um(20), buffer, zeta: { side: -0.05, floor: -0.05, lid: -0.05 }, wallZones: [] };

/** A horizontal channel from x0 to x1 of width w centred on y. */
function straight(x0: number, x1: number, y: number, w: number) {
  return { op: 'add' as const, type: 'rect' as const, x: Math.min(x0, x1), y: y - w / 2, width: Math.abs(x1 - x0), height: w, angle: 0 };
}

/** A vertical port across a channel end at x. */
function portX(id: string, name: string, x: number, y: number, w: number, potential: number | null, pressure = 0) {
  return { id, name, from: [x, y - w / 2] as [number, number], to: [x, y + w / 2] as [number, number], potential, pressure };
}

/** A horizontal port across a channel end at y. */
function portY(id: string, name: string, x: number, y: number, w: number, potential: number | null, pressure = 0) {
  return { id, name, from: [x - w / 2, y] as [number, number], to: [x + w / 2, y] as [number, number], potential, pressure };
}

/** Cross injector: 50 um legs, a 4 mm separation leg, pinched loading (sample 400 V to waste 0 V, side pushes). */
function crossInjector(): DesignInput {
  const w = um(50);
  return {
    ...base,
    name: 'Cross injector, 50 um legs',
    shapes: [
      straight(mm(-1), mm(4), 0, w),
      { op: 'add', type: 'rect', x: -w / 2, y: mm(-1), width: w, height: mm(2), angle: 0 },
    ],
    ports: [
      portY('S', 'sample', 0, mm(1), w, 400),
      portY('SW', 'sample waste', 0, mm(-1), w, 0),
      portX('B', 'buffer', mm(-1), 0, w, 250),
      portX('W', 'waste', mm(4), 0, w, 250),
    ],
  };
}

/**
 * Serpentine separation channel: four 2 mm straights joined by three 180° bends that turn alternately left and
 * right, so the skew one bend gives a band the next one takes back (complementary, compensated turns).
 */
function serpentine(): DesignInput {
  const w = um(50);
  const length = mm(2);
  // Straights every 200 um; each bend's centre line has a radius of 100 um (75 to 125 um).
  const shapes: DesignInput['shapes'] = [];
  for (let i = 0; i < 4; i++) shapes.push(straight(0, length, um(200 * i), w));
  for (let i = 0; i < 3; i++) {
    const right = i % 2 === 0;
    shapes.push({
      op: 'add',
      type: 'sector',
      center: [right ? length : 0, um(200 * i + 100)],
      innerRadius: um(75),
      outerRadius: um(125),
      startAngle: right ? -90 : 90,
      endAngle: right ? 90 : 270,
    });
  }
  return {
    ...base,
    name: 'Serpentine separation channel, compensated bends',
    shapes,
    ports: [portX('IN', 'injection end', 0, 0, w, 800), portX('OUT', 'detection end', 0, um(600), w, 0)],
  };
}

/** Expansion chamber (1 mm x 0.6 mm) between 100 um channels, with a 4 x 5 field of 60 um pillars. */
function expansionWithPillars(): DesignInput {
  const w = um(100);
  const pillars: DesignInput['shapes'] = [];
  for (let i = 0; i < 4; i++) {
    for (let j = 0; j < 5; j++) {
      pillars.push({ op: 'subtract', type: 'circle', center: [um(1200 + 200 * i), um(100 * (j - 2))], radius: um(30) });
    }
  }
  return {
    ...base,
    name: 'Expansion chamber with pillar field',
    shapes: [
      straight(0, mm(1), 0, w),
      { op: 'add', type: 'rect', x: mm(1), y: um(-300), width: mm(1), height: um(600), angle: 0 },
      straight(mm(2), mm(3), 0, w),
      ...pillars,
    ],
    ports: [portX('IN', 'inlet', 0, 0, w, 600), portX('OUT', 'outlet', mm(3), 0, w, 0)],
  };
}

/**
 * T-mixer: two 50 um inlets driven at 500 V meet a 100 um, 3 mm mixing leg to ground, whose reservoir stands
 * 3 mm of water higher (rho g h = 997 x 9.81 x 0.003 = 29.3 Pa): the back-pressure check.
 */
function tMixer(): DesignInput {
  const w = um(50);
  const stem = um(100);
  return {
    ...base,
    name: 'T-mixer with back-pressure check',
    shapes: [
      straight(mm(-1), mm(1), w / 2, w),
      { op: 'add', type: 'rect', x: -stem / 2, y: mm(-3), width: stem, height: mm(3) + w / 2, angle: 0 },
    ],
    ports: [
      portX('A', 'inlet A', mm(-1), w / 2, w, 500),
      portX('B', 'inlet B', mm(1), w / 2, w, 500),
      portY('OUT', 'mixed outlet', 0, mm(-3), stem, 0, 29.3),
    ],
  };
}

export interface DemoDesign {
  name: string;
  document: DesignInput;
  note: string;
}

export function demoDesigns(): DemoDesign[] {
  return [
    { name: 'Cross injector, 50 um legs', document: crossInjector(), note: 'Pinched loading voltages, first layout' },
    { name: 'Serpentine separation channel', document: serpentine(), note: 'Three alternating bends, 50 um wide' },
    { name: 'Expansion chamber with pillar field', document: expansionWithPillars(), note: '4 x 5 pillars, 60 um' },
    { name: 'T-mixer with back-pressure check', document: tMixer(), note: 'Outlet reservoir 3 mm of water higher' },
  ];
}
