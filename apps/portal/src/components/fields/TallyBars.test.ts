import { mount } from '@vue/test-utils';
import { describe, expect, test } from 'vitest';
import { tallyFields } from '../../utils/tally.ts';
import TallyBars from './TallyBars.vue';

describe('TallyBars', () => {
  test('should show the fields by level and by status, with the counts spoken and in the legend', () => {
    const tally = tallyFields([
      { maintenanceLevel: 1, status: 'open', areaM2: 7000 },
      { maintenanceLevel: 3, status: 'closed', areaM2: 5000 },
      { maintenanceLevel: 3, status: 'open', areaM2: 6000 },
    ]);
    const w = mount(TallyBars, { props: { tally } });
    expect(w.get('[data-test="level-count-3"]').text()).toBe('3 Community 2');
    expect(w.get('[data-test="status-count-closed"]').text()).toMatch(/Closed\s*1/);
    const bars = w.findAll('[role="img"]');
    expect(bars[0]!.attributes('aria-label')).toContain('Showcase 1');
    expect(bars[1]!.attributes('aria-label')).toContain('Closed 1');
    expect(w.findAll('.seg-level-3')[0]!.attributes('style')).toContain('width: 66.6');
  });
});
