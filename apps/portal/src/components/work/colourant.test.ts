import { describe, expect, test } from 'vitest';
import { colourantBody } from './colourant.ts';

describe('colourantBody', () => {
  test('should send a metric entry as it is, rounded to the API’s places', () => {
    expect(colourantBody({ product: 'Green 40', rate: 1.23456, area: 7140.26 }, false)).toEqual({ product: 'Green 40', rateMlPerM2: 1.235, areaM2: 7140.3 });
  });

  test('should turn fl oz per 1,000 ft² and ft² into mL per m² and m²', () => {
    // 1 US fl oz = 29.5735295625 mL and 1 ft² = 0.09290304 m², both exact (NIST Handbook 44, Appendix C):
    // 10 fl oz per 1,000 ft² = 295.735 mL / 92.90304 m² = 3.183 mL/m²; 10,000 ft² = 929.0 m².
    expect(colourantBody({ product: 'Green 40', rate: 10, area: 10_000 }, true)).toEqual({ product: 'Green 40', rateMlPerM2: 3.183, areaM2: 929 });
  });

  test('should send an empty rate or area as 0', () => {
    expect(colourantBody({ product: '', rate: null, area: null }, true)).toEqual({ product: '', rateMlPerM2: 0, areaM2: 0 });
  });
});
