import { niceStep, scaleBarLength, snapAngle, snapPoint, snapStep } from './snap';

describe('snapping', () => {
  it('rounds steps up to 1, 2 or 5 times a power of ten', () => {
    expect(niceStep(3e-6)).toBe(5e-6);
    expect(niceStep(1e-5)).toBe(1e-5);
    expect(niceStep(1.1e-5)).toBe(2e-5);
    expect(niceStep(6e-4)).toBe(1e-3);
  });

  it('chooses the snap step from the zoom', () => {
    // 1 px per um: grid lines at least 12 px apart → 20 um.
    expect(snapStep(1e6)).toBe(2e-5);
    // Zoomed in 10 times → 2 um.
    expect(snapStep(1e7)).toBe(2e-6);
  });

  it('snaps points and angles', () => {
    expect(snapPoint([1.26e-4, -3.4e-5], 1e-5)).toEqual([1.3e-4, -3e-5]);
    expect(snapAngle(47, 15)).toBe(45);
  });

  it('makes a round scale bar no longer than asked', () => {
    expect(scaleBarLength(1e6, 100)).toBe(1e-4);
    expect(scaleBarLength(1.5e6, 100)).toBe(5e-5);
  });
});
