import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { describe, expect, test } from 'vitest';
import NewButton from './NewButton.vue';

const mountAs = (actor: Actor) =>
  mount(NewButton, { props: { subject: 'Site', noun: 'site' }, global: { plugins: [ElementPlus, [abilitiesPlugin, defineAbilityFor(actor)]] } });

describe('NewButton', () => {
  test('should show "New site" to someone who may create a site, and say when it is pressed', async () => {
    const w = mountAs({ id: 1, role: 'admin', districtId: null, crewId: null, siteIds: [] });
    const button = w.find('[data-test="new-site"]');
    expect(button.text()).toBe('New site');
    await button.trigger('click');
    expect(w.emitted('click')).toHaveLength(1);
  });

  test('should not show to someone who may not create one', () => {
    const w = mountAs({ id: 7, role: 'crew', districtId: 1, crewId: 2, siteIds: [] });
    expect(w.find('[data-test="new-site"]').exists()).toBe(false);
  });
});
