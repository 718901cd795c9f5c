import { parseArgs, UsageError } from './args';

const fails = (argv: string[], pattern: RegExp) => {
  expect(() => parseArgs(argv)).toThrow(UsageError);
  expect(() => parseArgs(argv)).toThrow(pattern);
};

describe('command-line arguments (design-format.md)', () => {
  it('reads solve with every option, in any order, with or without =', () => {
    expect(parseArgs(['solve', 'd.json', '--cells', '256', '--probe', '5e-4,2.5e-5', '--probe=-1e-3,0', '--json', '--vtk', 'out.vtk'])).toEqual({
      command: 'solve', file: 'd.json', cells: 256, probes: [[5e-4, 2.5e-5], [-1e-3, 0]], json: true, vtk: 'out.vtk',
    });
    expect(parseArgs(['solve', '--json', 'd.json'])).toEqual({ command: 'solve', file: 'd.json', probes: [], json: true });
    expect(parseArgs(['solve', 'd.json', '--cells=8'])).toMatchObject({ cells: 8 });
    expect(parseArgs(['--help'])).toEqual({ command: 'help' });
  });

  it('names each mistake', () => {
    fails([], /no command/);
    fails(['run', 'd.json'], /unknown command "run"/);
    fails(['solve'], /no design file/);
    fails(['solve', 'a.json', 'b.json'], /one design file at a time/);
    fails(['solve', 'd.json', '--bogus'], /unknown option "--bogus"/);
    fails(['solve', 'd.json', '--cells'], /--cells needs a value/);
    for (const bad of ['0', '-3', '1.5', 'abc', '', '1e3', '99999999999999999999']) fails(['solve', 'd.json', '--cells', bad], /--cells must be a positive whole number/);
    for (const bad of ['1', '1,2,3', 'a,b', '1,', ',1', 'NaN,1', 'Infinity,0', '1e999,0']) fails(['solve', 'd.json', '--probe', bad], /--probe must be two numbers/);
    fails(['solve', 'd.json', '--json=yes'], /--json takes no value/);
    fails(['solve', 'd.json', '--vtk='], /--vtk needs a file name/);
  });
});

describe('export and import arguments', () => {
  it('reads export and import', () => {
    expect(parseArgs(['export', 'd.json', '--format', 'DXF', '--out', 'm.dxf'])).toEqual({ command: 'export', file: 'd.json', format: 'dxf', out: 'm.dxf' });
    expect(parseArgs(['import', 'a.svg', '--scale=1e-6', '--out', 'd.json'])).toEqual({ command: 'import', file: 'a.svg', scale: 1e-6, out: 'd.json' });
    expect(parseArgs(['solve', 'd.json', '--csv', 'r.csv'])).toMatchObject({ csv: 'r.csv' });
  });

  it.each([
    [['export', 'd.json', '--out', 'x'], /--format/],
    [['export', 'd.json', '--format', 'png', '--out', 'x'], /svg or dxf/],
    [['import', 'a.svg'], /--out/],
    [['import', 'a.svg', '--scale', '-1', '--out', 'x'], /positive/],
    [['import', '--out', 'x'], /no drawing file/],
  ])('refuses %j', (argv, message) => {
    expect(() => parseArgs(argv)).toThrow(message);
  });
});
