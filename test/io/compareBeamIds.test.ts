import { describe, expect, it } from 'vitest';
import { compareBeamIds } from '../../src/io/compareBeamIds.js';

describe('compareBeamIds', () => {
  it('orders digit runs by value (the doc example)', () => {
    expect(['10', '2', 'b1', '1'].sort(compareBeamIds)).toEqual(['1', '2', '10', 'b1']);
  });
  it('orders mixed ids and keeps a total order for equal values', () => {
    expect(['h-10', 'h-9', 'v-1', 'h-01', 'h-1'].sort(compareBeamIds)).toEqual(['h-01', 'h-1', 'h-9', 'h-10', 'v-1']);
    expect(compareBeamIds('7', '7')).toBe(0);
  });
});
