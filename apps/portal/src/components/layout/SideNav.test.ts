import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor, type Role } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import { describe, expect, test } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import SideNav from './SideNav.vue';

const ACTORS: Record<Role, Actor> = {
  admin: { id: 1, role: 'admin', districtId: null, crewId: null, siteIds: [] },
  head: { id: 2, role: 'head', districtId: null, crewId: null, siteIds: [] },
  foreman: { id: 3, role: 'foreman', districtId: 1, crewId: null, siteIds: [] },
  crew: { id: 4, role: 'crew', districtId: 1, crewId: 2, siteIds: [] },
  partner: { id: 5, role: 'partner', districtId: null, crewId: null, siteIds: [7, 8] },
};

function mountNav(role: Role) {
  const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:any(.*)*', component: { template: '<div />' } }] });
  return mount(SideNav, {
    props: { role },
    global: { plugins: [router, [abilitiesPlugin, defineAbilityFor(ACTORS[role])]] },
  });
}

const keys = (w: ReturnType<typeof mountNav>) => w.findAll('[data-test^="nav-"]').map((a) => a.attributes('data-test'));

describe('SideNav', () => {
  test.each([
    ['admin', ['nav-overview', 'nav-requests', 'nav-sites', 'nav-fields', 'nav-map', 'nav-crews', 'nav-equipment', 'nav-weather', 'nav-standards', 'nav-costs', 'nav-budget', 'nav-what-if', 'nav-compare', 'nav-week', 'nav-records', 'nav-imports', 'nav-users', 'nav-audit', 'nav-mail-outbox']],
    ['head', ['nav-overview', 'nav-requests', 'nav-sites', 'nav-fields', 'nav-map', 'nav-crews', 'nav-equipment', 'nav-weather', 'nav-standards', 'nav-costs', 'nav-budget', 'nav-what-if', 'nav-compare', 'nav-week', 'nav-records', 'nav-imports', 'nav-audit', 'nav-mail-outbox']],
    ['foreman', ['nav-district', 'nav-requests', 'nav-sites', 'nav-fields', 'nav-map', 'nav-crews', 'nav-equipment', 'nav-weather', 'nav-costs', 'nav-budget', 'nav-what-if', 'nav-compare', 'nav-week', 'nav-records', 'nav-imports']],
    ['crew', ['nav-today', 'nav-fields', 'nav-map']],
    ['partner', ['nav-my-fields', 'nav-requests', 'nav-map']],
  ] as [Role, string[]][])('should show a %s only the links of that role', (role, expected) => {
    expect(keys(mountNav(role))).toEqual(expected);
  });

  test('should hide a link the ability refuses even when the role lists it', () => {
    const ability = defineAbilityFor(ACTORS.head);
    ability.update(ability.rules.filter((r) => !(r.subject as string[] | string).includes('AuditEntry')));
    const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:any(.*)*', component: { template: '<div />' } }] });
    const w = mount(SideNav, { props: { role: 'head' }, global: { plugins: [router, [abilitiesPlugin, ability]] } });
    expect(keys(w)).not.toContain('nav-audit');
    expect(keys(w)).toContain('nav-overview');
  });

  test('should point each link at its page', () => {
    const w = mountNav('admin');
    expect(w.get('[data-test="nav-users"]').attributes('href')).toBe('/admin/users');
    expect(w.get('[data-test="nav-audit"]').attributes('href')).toBe('/audit');
  });
});
