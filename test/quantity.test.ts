import { describe, expect, it } from 'vitest';
import {
  QUANTITIES, bestFirst, bestOf, betterByDb, betterSign, hasTrp, isAtOrBetter, isBetter, isLowerBetter, isQuantity,
  quantityLabel, quantityUnit, resolveQuantity, worsenedBy, worstOf, worstValue,
} from '../src/quantity.js';

// Source of the sense: CONTRACT.md ("peak is the best value: the maximum for eirp/gain, the
// minimum (most sensitive) for eis") and 3GPP TS 38.101-2 (EIS spherical coverage on the minimum EIS).
describe('quantity owner', () => {
  it('lists the three quantities with their units and labels', () => {
    expect([...QUANTITIES]).toEqual(['eirp', 'eis', 'gain']);
    expect(QUANTITIES.map(quantityUnit)).toEqual(['dBm', 'dBm', 'dBi']);
    expect(QUANTITIES.map(quantityLabel)).toEqual(['EIRP', 'EIS', 'Gain']);
    expect(isQuantity('eis')).toBe(true);
    expect(isQuantity('EIS')).toBe(false);
    expect(QUANTITIES.map(hasTrp)).toEqual([true, false, true]);
  });

  it('eis is better when lower, eirp and gain when higher', () => {
    expect(QUANTITIES.map(isLowerBetter)).toEqual([false, true, false]);
    expect(isBetter('eis', -90, -88)).toBe(true);
    expect(isBetter('eirp', -90, -88)).toBe(false);
    expect(isBetter('gain', 3, 3)).toBe(false);
    expect(isAtOrBetter('eis', -88, -88)).toBe(true);
    expect(isAtOrBetter('eirp', 10, 10.5)).toBe(false);
    expect(betterSign('eis')).toBe(-1);
    expect([3, 1, 2].sort(bestFirst('eis'))).toEqual([1, 2, 3]);
    expect([3, 1, 2].sort(bestFirst('eirp'))).toEqual([3, 2, 1]);
  });

  it('best, worst and the worst value that the unmeasured share counts as', () => {
    expect(bestOf('eirp', [1, 5, 3])).toBe(5);
    expect(bestOf('eis', [-80, -95, -90])).toBe(-95);
    expect(worstOf('eirp', [1, 5, 3])).toBe(1);
    expect(worstOf('eis', [-80, -95, -90])).toBe(-80);
    expect(worstValue('eirp')).toBe(-Infinity);
    expect(worstValue('eis')).toBe(Infinity);
    expect(bestOf('gain', [])).toBe(-Infinity);
  });

  it('moves a threshold towards worse and measures how much better a value is', () => {
    expect(worsenedBy('eirp', 20, 1.5)).toBe(18.5); // a test tolerance relaxes a floor downwards
    expect(worsenedBy('eis', -90, 1.5)).toBe(-88.5); // and an EIS ceiling upwards
    expect(betterByDb('eirp', 12, 10)).toBe(2);
    expect(betterByDb('eis', -92, -90)).toBe(2);
  });

  it('resolves in one order: option > job > columns > metadata > assumed eirp', () => {
    expect(resolveQuantity({ option: 'gain', job: 'eis', columns: 'eirp', metadata: 'eirp' })).toEqual({ quantity: 'gain', from: 'option' });
    expect(resolveQuantity({ job: 'eis', columns: 'eirp' })).toEqual({ quantity: 'eis', from: 'job' });
    expect(resolveQuantity({ columns: 'gain', metadata: 'eis' })).toEqual({ quantity: 'gain', from: 'columns' });
    expect(resolveQuantity({ metadata: 'eis' })).toEqual({ quantity: 'eis', from: 'metadata' });
    expect(resolveQuantity({})).toEqual({ quantity: 'eirp', from: 'assumed' });
  });
});
