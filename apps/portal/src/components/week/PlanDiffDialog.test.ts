import type { PlanDiff } from '@swardwise/domain';
import { describe, expect, test } from 'vitest';
import { $ as q, cleanUpAfterEach, mountDialog as mountDialogWith } from '../../testing/dialogs.ts';
import PlanDiffDialog from './PlanDiffDialog.vue';
import { DATES, diffItem } from './sample.ts';

function diffOf(over: Partial<PlanDiff>): PlanDiff {
  const d = { added: [], removed: [], changed: [], kept: [], ...over } as Omit<PlanDiff, 'summary'>;
  return { ...d, summary: { added: d.added.length, removed: d.removed.length, changed: d.changed.length, kept: d.kept.length, unchanged: 0 } };
}

const mountDialog = (diff: PlanDiff) => mountDialogWith(PlanDiffDialog, { diff, applying: false, weekText: '30 Nov – 6 Dec 2026' });
cleanUpAfterEach();

describe('PlanDiffDialog', () => {
  test('should sum up the diff and open on the first kind of change there is', async () => {
    const w = await mountDialog(
      diffOf({
        changed: [{ before: diffItem({ plannedDate: DATES[0]! }), after: diffItem({ plannedDate: DATES[2]!, crewName: 'North B', crewId: 12, reason: 'Moved after the rain' }), what: ['date', 'crew'] }],
        kept: [diffItem(), diffItem({ fieldName: 'Lawn' })],
      }),
    );
    expect(q('[data-test="diff-summary"]')!.textContent!.replace(/\s+/g, ' ')).toContain('0 added · 1 changed · 0 removed · 2 kept');
    const active = document.body.querySelector('.el-tabs__item.is-active')!;
    expect(active.textContent).toBe('Changed (1)');
    const row = q('[data-test="diff-changed"] [data-test="diff-row"]')!;
    expect(row.textContent).toContain('day, crew');
    expect(row.textContent).toContain('Mon 30 Nov · North A · 1:30 h');
    expect(row.textContent).toContain('Wed 2 Dec · North B · 1:30 h');
    expect(row.textContent).toContain('Moved after the rain');
    w.unmount();
  });

  test('should list added and removed orders with their reasons', async () => {
    const w = await mountDialog(
      diffOf({
        added: [diffItem({ fieldName: 'Diamond 2', task: 'paint_lines', reason: 'Lines before the game on Saturday' }), diffItem({ crewId: null, crewName: null })],
        removed: [diffItem({ fieldName: 'Old lawn', reason: 'The grass is below the one-third line now' })],
      }),
    );
    const added = [...document.body.querySelectorAll('[data-test="diff-added"] [data-test="diff-row"]')].map((r) => r.textContent);
    expect(added).toHaveLength(2);
    expect(added[0]).toContain('Paint lines');
    expect(added[0]).toContain('Lines before the game on Saturday');
    expect(added[1]).toContain('Unassigned');
    expect(q('[data-test="diff-removed"]')!.textContent).toContain('The grass is below the one-third line now');
    w.unmount();
  });

  test('should apply only when confirmed', async () => {
    const w = await mountDialog(diffOf({ added: [diffItem()] }));
    expect(w.emitted('confirm')).toBeUndefined();
    (q('[data-test="diff-apply"]') as HTMLButtonElement).click();
    expect(w.emitted('confirm')).toHaveLength(1);
    expect(q('[data-test="diff-apply"]')!.textContent).toContain('Apply to the week');
    w.unmount();
  });

  test('should ask to close on Cancel', async () => {
    const w = await mountDialog(diffOf({ added: [diffItem()] }));
    ([...document.body.querySelectorAll('.el-dialog__footer button')].find((b) => b.textContent?.trim() === 'Cancel') as HTMLButtonElement).click();
    expect(w.emitted('update:open')).toEqual([[false]]);
    w.unmount();
  });

  test('should say so when generating changes nothing', async () => {
    const w = await mountDialog(diffOf({ kept: [diffItem()] }));
    expect(q('[data-test="diff-apply"]')!.textContent).toContain('Apply (no changes)');
    expect(q('[data-test="diff-added"]')!.textContent).toContain('No new work orders.');
    w.unmount();
  });
});
