import { COLOUR_MAPS, colourAt, colourHex, colourTable, lightness } from './colour-maps';

describe('colour maps', () => {
  it.each(['cividis', 'viridis'] as const)('%s rises in lightness from end to end (a sequential map)', (name) => {
    const l = COLOUR_MAPS[name].stops.map(lightness);
    for (let k = 1; k < l.length; k++) expect(l[k]).toBeGreaterThan(l[k - 1]);
    expect(l[l.length - 1] - l[0]).toBeGreaterThan(60);
  });

  it('cool-warm is lightest in the middle and falls off to both ends', () => {
    const l = COLOUR_MAPS['cool-warm'].stops.map(lightness);
    const mid = (l.length - 1) / 2;
    for (let k = 1; k <= mid; k++) expect(l[k]).toBeGreaterThan(l[k - 1]);
    for (let k = mid + 1; k < l.length; k++) expect(l[k]).toBeLessThan(l[k - 1]);
    // The two ends are about equally dark, so neither sign looks stronger.
    expect(Math.abs(l[0] - l[l.length - 1])).toBeLessThan(12);
  });

  it('interpolates between stops and clamps outside [0, 1]', () => {
    expect(colourAt('viridis', 0)).toEqual([68, 1, 84]);
    expect(colourAt('viridis', 1)).toEqual([253, 231, 37]);
    expect(colourAt('viridis', -3)).toEqual([68, 1, 84]);
    expect(colourAt('viridis', 7)).toEqual([253, 231, 37]);
    expect(colourAt('cool-warm', 0.5)).toEqual([221, 221, 221]);
    expect(colourHex('cividis', 0)).toBe('#00224e');
    const t = colourTable('cividis', 3);
    expect(Array.from(t.slice(0, 3))).toEqual([0, 34, 78]);
    expect(Array.from(t.slice(6, 9))).toEqual([254, 232, 56]);
  });
});
