import { colourAt } from '../../../../shared/colour-maps';
import { fieldImage } from './field-image';
import type { ColourRange } from './field-maps';

const range: ColourRange = { min: 0, max: 1, belowMin: false, aboveMax: false, colourMap: 'viridis', empty: false };

describe('fieldImage', () => {
  it('colours cells from the map, with the top row of the grid as the first image row', () => {
    // 2 × 2: bottom row [0, 1], top row [1, 0].
    const img = fieldImage(Float32Array.from([0, 1, 1, 0]), 2, 2, range);
    const px = (k: number) => Array.from(img.slice(4 * k, 4 * k + 4));
    expect(px(0)).toEqual([...colourAt('viridis', 1), 255]); // image (0,0) = cell (0,1)
    expect(px(2)).toEqual([...colourAt('viridis', 0), 255]); // image (0,1) = cell (0,0)
    expect(px(3)).toEqual([...colourAt('viridis', 1), 255]);
  });

  it('leaves cells far from the fluid transparent and gives those beside it a neighbour colour', () => {
    const img = fieldImage(Float32Array.from([0.5, NaN, NaN]), 3, 1, range);
    expect(Array.from(img.slice(4, 8))).toEqual([...colourAt('viridis', 0.5), 255]);
    expect(img[11]).toBe(0);
  });

  it('clamps values beyond the range to the end colours', () => {
    const img = fieldImage(Float32Array.from([-3, 9]), 2, 1, { ...range, colourMap: 'cool-warm' });
    expect(Array.from(img.slice(0, 3))).toEqual(colourAt('cool-warm', 0));
    expect(Array.from(img.slice(4, 7))).toEqual(colourAt('cool-warm', 1));
  });
});
