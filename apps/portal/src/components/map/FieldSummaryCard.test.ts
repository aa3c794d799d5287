import type { MapField, SessionUser, UnitSystem } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia, setActivePinia } from 'pinia';
import { describe, expect, test } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import { useSessionStore } from '../../stores/session.ts';
import FieldSummaryCard from './FieldSummaryCard.vue';

const FIELD: MapField = {
  id: 7, siteId: 2, districtId: 1, name: 'Pitch 1', sport: 'soccer', grass: 'cool', maintenanceLevel: 2, status: 'open',
  areaM2: 7140, longAxisDeg: 10, eastWest: false, score: 71, scoredOn: '2026-11-20', lastMowedOn: '2026-11-28', daysSinceMowing: 4,
  hocMm: 25.4, predictedHeightMm: 31.75, overdue: false, overdueSince: null, version: 1, geometry: { type: 'Polygon', coordinates: [] },
} as unknown as MapField;

function mountCard(units: UnitSystem) {
  const pinia = createPinia();
  setActivePinia(pinia);
  useSessionStore().user = { id: 1, email: 'a@test.example', name: 'A', role: 'crew', districtId: 1, crewId: 1, siteIds: [], units, version: 1 } as SessionUser;
  const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:any(.*)*', component: { template: '<div />' } }] });
  return mount(FieldSummaryCard, { props: { field: FIELD, siteName: 'Alder Green', asOf: '2026-12-02', canEdit: false, canDelete: false }, global: { plugins: [ElementPlus, pinia, router] } });
}

describe('FieldSummaryCard', () => {
  test('should show an imperial user the HOC in inches to the eighth and the area in acres', () => {
    const text = mountCard('imperial').text();
    expect(text).toContain('HOC 1 in');
    expect(text).toContain('about 1¼ in');
    expect(text).toMatch(/1\.76 ac/);
    expect(text).not.toMatch(/\bmm\b|m²|\bha\b/);
  });

  test('should show a metric user millimetres and hectares', () => {
    const text = mountCard('metric').text();
    expect(text).toContain('HOC 25 mm');
    expect(text).toMatch(/0\.71 ha/);
  });
});
