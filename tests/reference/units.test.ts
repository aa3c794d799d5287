/**
 * Unit conversions cross-checked against the independent `convert-units` package. Its
 * factors are rounded to 6–7 significant figures (e.g. ft² = 0.0929031 m², lb = 0.453592 kg),
 * so the comparison is relative to 1e-5 (ours are the exact 1959 definitions).
 */
import { describe, expect, test } from 'vitest';
import convert from 'convert-units';
import * as e from '@swardwise/domain/engine';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-12);

describe('unit conversions vs convert-units', () => {
  test.each([
    ['mm→in', e.mmToIn(38), convert(38).from('mm').to('in')],
    ['in→mm', e.inToMm(1.5), convert(1.5).from('in').to('mm')],
    ['m→ft', e.mToFt(105), convert(105).from('m').to('ft')],
    ['ft→m', e.ftToM(360), convert(360).from('ft').to('m')],
    ['m²→ft²', e.m2ToFt2(7140), convert(7140).from('m2').to('ft2')],
    ['ft²→m²', e.ft2ToM2(1000), convert(1000).from('ft2').to('m2')],
    ['m²→ac', e.m2ToAcres(7140), convert(7140).from('m2').to('ac')],
    ['ac→m²', e.acresToM2(1.76), convert(1.76).from('ac').to('m2')],
    ['ha→ac', e.haToAcres(2.5), convert(2.5).from('ha').to('ac')],
    ['ac→ha', e.acresToHa(10), convert(10).from('ac').to('ha')],
    ['kg→lb', e.kgToLb(22.7), convert(22.7).from('kg').to('lb')],
    ['lb→kg', e.lbToKg(50), convert(50).from('lb').to('kg')],
    ['L→gal', e.litresToUsGallons(1000), convert(1000).from('l').to('gal')],
    ['gal→L', e.usGallonsToLitres(5), convert(5).from('gal').to('l')],
    ['km/h→mph', e.kmhToMph(10), convert(10).from('km/h').to('m/h')],
    ['mph→km/h', e.mphToKmh(5), convert(5).from('m/h').to('km/h')],
    ['°C→°F', e.cToF(31), convert(31).from('C').to('F')],
    ['°F→°C', e.fToC(68), convert(68).from('F').to('C')],
  ])('should match convert-units for %s', (_name, ours, theirs) => {
    expect(rel(ours, theirs)).toBeLessThan(1e-5);
  });

  test('should match convert-units for g N/m² → lb N/1000 ft² (composed: g→lb over m²→ft²)', () => {
    const theirs = (convert(4.88).from('g').to('lb') / convert(1).from('m2').to('ft2')) * 1000;
    expect(rel(e.gPerM2ToLbPer1000Ft2(4.88), theirs)).toBeLessThan(1e-5);
  });

  test('should match convert-units for mm over m² → US gallons (composed: mm × m² = L)', () => {
    const theirs = convert(25.4 * 92.90304).from('l').to('gal');
    expect(rel(e.depthMmOverAreaToUsGallons(25.4, 92.90304), theirs)).toBeLessThan(1e-5);
  });
});
