import { parseArgs, UsageError, USAGE } from './args';

const fails = (argv: string[], pattern: RegExp) => {
  expect(() => parseArgs(argv)).toThrow(UsageError);
  expect(() => parseArgs(argv)).toThrow(pattern);
};

describe('compare, trace, plan and edl arguments', () => {
  it('lists every analysis command in the usage text', () => {
    for (const c of ['compare', 'trace', 'plan', 'edl']) expect(USAGE).toContain(`osmolane ${c} `);
  });

  it('reads compare', () => {
    expect(parseArgs(['compare', 'd.json', '--port', 'W', '--cells=120', '--json'])).toEqual({ command: 'compare', file: 'd.json', port: 'W', cells: 120, json: true });
    expect(parseArgs(['compare', '--port=S', 'd.json', '--diffusivity', '5e-10'])).toEqual({ command: 'compare', file: 'd.json', port: 'S', diffusivity: 5e-10, json: false });
    fails(['compare', 'd.json'], /compare needs --port ID/);
    fails(['compare', '--port', 'W'], /no design file given for compare/);
    fails(['compare', 'd.json', '--port', 'W', '--bogus'], /unknown option "--bogus".*osmolane compare/);
    fails(['compare', 'd.json', '--port', 'W', '--diffusivity', '-1'], /--diffusivity must be a positive number/);
    expect(parseArgs(['compare', 'd.json', '--port', 'W', '--particles', '500', '--seed=3'])).toEqual({ command: 'compare', file: 'd.json', port: 'W', particles: 500, seed: 3, json: false });
    expect(parseArgs(['compare', 'd.json', '--port', 'W', '--particles', '0'])).toMatchObject({ particles: 0 });
    fails(['compare', 'd.json', '--port', 'W', '--particles', '1.5'], /--particles/);
  });

  it('reads trace with a line, a region, phases and the pinched preset', () => {
    expect(
      parseArgs(['trace', 'd.json', '--species', '-2e-8,1e-10', '--from', '1e-4,0,1e-4,5e-5', '--detector=2e-3,0,2e-3,5e-5', '--particles', '800', '--seed', '7', '--json']),
    ).toEqual({
      command: 'trace', file: 'd.json', species: { mobility: -2e-8, diffusivity: 1e-10 }, pinched: false, phases: [], json: true,
      injection: { kind: 'line', from: [1e-4, 0], to: [1e-4, 5e-5] }, detector: { from: [2e-3, 0], to: [2e-3, 5e-5] }, particles: 800, seed: 7,
    });
    expect(parseArgs(['trace', 'd.json', '--species=0,1e-9', '--region', '0,0,1e-4,0,1e-4,1e-4', '--duration', '0.5'])).toMatchObject({
      injection: { kind: 'region', polygon: [[0, 0], [1e-4, 0], [1e-4, 1e-4]] }, duration: 0.5,
    });
    expect(parseArgs(['trace', 'd.json', '--species', '0,1e-9', '--pinched', '--phase', '0.05:S=400,SW=0,B=float', '--phase', 'auto:B=600,W=0'])).toMatchObject({
      pinched: true,
      phases: [{ duration: 0.05, potentials: { S: 400, SW: 0, B: null } }, { potentials: { B: 600, W: 0 } }],
    });
  });

  it('names each trace mistake', () => {
    fails(['trace', 'd.json', '--from', '0,0,1,1', '--detector', '0,0,1,1'], /trace needs --species/);
    fails(['trace', 'd.json', '--species', '1e-8', '--pinched'], /--species must be MOBILITY,DIFFUSIVITY/);
    fails(['trace', 'd.json', '--species', '0,-1e-9', '--pinched'], /diffusivity must not be negative/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--detector', '0,0,1,1'], /--from X1,Y1,X2,Y2 or --region/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--from', '0,0,1,1'], /--detector X1,Y1,X2,Y2, or a --duration/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--from', '0,0,1'], /--from must be X1,Y1,X2,Y2/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--region', '0,0,1,1'], /--region must be X1,Y1,X2,Y2,X3,Y3/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--pinched', '--particles', '5'], /--particles must be a whole number of at least 10/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--pinched', '--phase', 'S=1'], /--phase must be DURATION:PORT=V/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--pinched', '--phase', 'auto:S=1', '--phase', '1:B=0'], /only the last phase may run for "auto"/);
    fails(['trace', 'd.json', '--species', '0,1e-9', '--pinched', '--duration', '0'], /--duration must be a positive number/);
  });

  it('reads plan targets, holds, floating ports and bounds', () => {
    expect(
      parseArgs(['plan', 'd.json', '--target', 'speed:W:-1e-3', '--target=ratio:SW:0.5:W', '--hold', 'B=0', '--float', 'S', '--bounds', 'SW=-1500:1500', '--bounds', 'W=:2000', '--json']),
    ).toEqual({
      command: 'plan', file: 'd.json', json: true,
      targets: [{ kind: 'speed', port: 'W', value: -1e-3 }, { kind: 'ratio', port: 'SW', value: 0.5, of: 'W' }],
      hold: [{ port: 'B', value: 0 }], float: ['S'], bounds: [{ port: 'SW', min: -1500, max: 1500 }, { port: 'W', min: -Infinity, max: 2000 }],
    });
    fails(['plan', 'd.json'], /plan needs at least one --target/);
    fails(['plan', 'd.json', '--target', 'pressure:W:1'], /--target must be KIND:PORT:VALUE/);
    fails(['plan', 'd.json', '--target', 'ratio:SW:0.5'], /ratio needs the port it is a ratio OF/);
    fails(['plan', 'd.json', '--target', 'flow:W:1:S'], /--target flow takes KIND:PORT:VALUE/);
    fails(['plan', 'd.json', '--target', 'flow:W:1', '--hold', 'B'], /--hold must be PORT=VOLTS/);
    fails(['plan', 'd.json', '--target', 'flow:W:1', '--bounds', 'S=5:1'], /minimum is above the maximum/);
  });

  it('reads edl with or without a design', () => {
    expect(parseArgs(['edl', '--ionic-strength', '10', '--zeta', '-0.05', '--temperature', '298.15', '--json'])).toEqual({
      command: 'edl', ionicStrength: 10, zeta: -0.05, temperature: 298.15, json: true, file: undefined,
    });
    expect(parseArgs(['edl', 'd.json', '--depth', '2e-5'])).toMatchObject({ file: 'd.json', depth: 2e-5 });
    fails(['edl', '--zeta', '-0.05'], /edl needs --ionic-strength, --temperature/);
    fails(['edl', '--ionic-strength', '0', '--zeta', '-0.05', '--temperature', '298'], /--ionic-strength must be a positive number/);
  });
});
