import type { FieldNeeds } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import { describe, expect, test } from 'vitest';
import NeedCard from './NeedCard.vue';
import { buildNeedCards } from './needCards.ts';

const explained = (inputs: FieldNeeds['hoc']['inputs'] = []) => ({ inputs, how: 'Worked out by the engine from the inputs.', cautions: [] as string[] });

function needs(): FieldNeeds {
  return {
    fieldId: 1,
    requestedDate: '2026-06-03',
    week: { start: '2026-06-01', end: '2026-06-07', days: 7, fallback: false },
    weatherNote: null,
    weatherGap: null,
    station: { id: 1, code: 'T', name: 'Test', distanceKm: 2, hargreavesDays: 0 },
    standards: { level: 2, name: 'Competition', version: 1, missingLevels: [] },
    hoc: { ...explained([{ key: 'override', label: 'Field override', value: null, unit: 'mm' }, { key: 'standardsHoc', label: 'Standards HOC', value: 50.8, unit: 'mm' }]), hocMm: 50.8, source: 'standards_sport', triggerHeightMm: 76.2, mowerKind: 'rotary', mowerWarnings: [] },
    growth: { ...explained(), gpDaily: [], gpMean: 0.8, growthMmPerDay: 3, growthMmWeek: 21 },
    mowing: { intervalDays: 3, plannedThisWeek: null, ...explained(), mowingsThisWeek: 2, mowingsPerWeek: 2, weekMowingDates: [], nextMowingOn: '2026-06-04', nextMowingNote: null, overdueOn: '2026-06-09', overdueNow: false, lastMowedOn: '2026-06-01' },
    labour: { ...explained([{ key: 'area', label: 'Field area', value: 4046.8564224, unit: 'm2' }]), method: 'field_capacity', hoursPerMowing: 0.5, hoursPerWeek: 1, seasonHours: 30, passPlan: null, capacityHours: 0.5 },
    water: { ...explained(), cautions: ['Watering restrictions are local law.'], irrigated: true, notIrrigatedReason: null, et0Method: 'penman_monteith', et0Mm: 25.4, kc: 0.95, etcMm: 24.13, rainMm: 0, effectiveRainMm: 0, shareOfEtc: 0.8, netMm: 19.3, grossMm: 27.6, runTimeMin: 138, volumeL: 3785.411784 },
    feed: { ...explained(), annualNGPerM2: 4.8824, reasons: [], monthlyNGPerM2: [], product: { analysis: '28-0-6', slowReleaseShare: 0.5, bagKg: 22.7 }, applications: [], nextApplication: null, productKgSeason: 10 },
    lines: { ...explained(), kept: false, reason: 'No lines are kept on this kind of field.', template: null, lineLengthM: 0, elements: [], paintedAreaM2: 0, mixedLitres: 0, concentrateLitres: 0, waterLitres: 0, hoursPerRepaint: 0, firstCoat: { mixedLitres: 0, concentrateLitres: 0, waterLitres: 0, hours: 0 }, repaintDays: null, repaints: 0, firstCoats: 0, touchUps: 0, seasonMixedLitres: 0, seasonConcentrateLitres: 0, seasonHours: 0 },
    level: { ...explained(), assigned: 2, recommended: 3, points: 4, reasons: ['x'], targetScore: 75, latestCheck: null, scoreMet: null, workCompliance: { tracked: false, note: 'Not tracked yet.', from: '2026-11-09', to: '2026-12-06', tally: null } },
    season: { stationId: 1, start: '2026-06-01', end: '2026-06-07', dates: [], gp: [], growthMm: [], waterNeedMm: [], mowings: [], feedApplications: [] },
  };
}

const card = (key: string, units: 'imperial' | 'metric') => buildNeedCards(needs(), units).find((c) => c.key === key)!;

describe('NeedCard', () => {
  test('should show HOC, water and N in inches, gallons and lb N/1000 ft² for imperial users', () => {
    const hoc = mount(NeedCard, { props: { card: card('hoc', 'imperial'), units: 'imperial' } });
    expect(hoc.find('[data-test="needs-hoc"]').text()).toBe('2 in');
    expect(hoc.text()).toContain('Field override');
    expect(hoc.text()).toContain('—');
    const water = mount(NeedCard, { props: { card: card('water', 'imperial'), units: 'imperial' } });
    expect(water.find('[data-test="needs-water-gross"]').text()).toBe('1.09 in');
    expect(water.text()).toContain('1,000 gal');
    expect(water.findAll('[data-test="needs-caution"]')).toHaveLength(1);
    const feed = mount(NeedCard, { props: { card: card('feed', 'imperial'), units: 'imperial' } });
    expect(feed.find('[data-test="needs-annual-n"]').text()).toBe('1 lb N/1000 ft²');
  });

  test('should show the same figures in mm, litres and g N/m² for metric users', () => {
    const hoc = mount(NeedCard, { props: { card: card('hoc', 'metric'), units: 'metric' } });
    expect(hoc.find('[data-test="needs-hoc"]').text()).toBe('51 mm');
    const water = mount(NeedCard, { props: { card: card('water', 'metric'), units: 'metric' } });
    expect(water.find('[data-test="needs-water-gross"]').text()).toBe('27.6 mm');
    expect(water.text()).toContain('3,785 L');
    const labour = mount(NeedCard, { props: { card: card('labour', 'metric'), units: 'metric' } });
    expect(labour.text()).toContain('4,047 m²');
  });

  test('should say plainly when a block does not apply', () => {
    const lines = mount(NeedCard, { props: { card: card('lines', 'metric'), units: 'metric' } });
    expect(lines.find('[data-test="needs-line-length"]').text()).toBe('None kept');
    expect(lines.text()).toContain('No lines are kept on this kind of field.');
    const level = mount(NeedCard, { props: { card: card('level', 'metric'), units: 'metric' } });
    expect(level.find('[data-test="needs-recommended-level"]').text()).toBe('3 Community');
    expect(level.text()).toContain('Not tracked yet.');
  });
});
