import { describe, expect, test, vi } from 'vitest';
import { computed, ref } from 'vue';
import { resetOnOpen, useDialogForm, useEditDialog } from './useDialogForm.ts';

describe('useEditDialog', () => {
  test('should open on the row to edit, or on none for a new one', () => {
    const list = { data: computed(() => [{ id: 1, name: 'Alder Green' }]), refetch: vi.fn(async () => undefined) };
    const dialog = useEditDialog(list);
    expect(dialog.open.value).toBe(false);
    dialog.edit(list.data.value[0]!);
    expect([dialog.open.value, dialog.editing.value?.name]).toEqual([true, 'Alder Green']);
    dialog.edit(null);
    expect(dialog.editing.value).toBeNull();
  });

  test('should read the list again on Reload and edit the fresh row', async () => {
    const rows = ref([{ id: 1, name: 'Alder Green', version: 1 }]);
    const list = { data: computed(() => rows.value), refetch: vi.fn(async () => void (rows.value = [{ id: 1, name: 'Alder Green Park', version: 2 }])) };
    const dialog = useEditDialog(list);
    dialog.edit(rows.value[0]!);
    await dialog.reloadEditing();
    expect(list.refetch).toHaveBeenCalledTimes(1);
    expect(dialog.editing.value).toEqual({ id: 1, name: 'Alder Green Park', version: 2 });
  });
});

describe('resetOnOpen', () => {
  test('should fill the form and clear the last errors each time the dialog opens', async () => {
    const open = ref(false);
    const fill = vi.fn();
    const clearValidate = vi.fn();
    const submission = { clear: vi.fn(), form: ref({ clearValidate }) as never };
    resetOnOpen(open, () => null, fill, submission);
    expect(fill).not.toHaveBeenCalled();
    open.value = true;
    await Promise.resolve();
    expect([fill.mock.calls.length, submission.clear.mock.calls.length, clearValidate.mock.calls.length]).toEqual([1, 1, 1]);
    open.value = false;
    await Promise.resolve();
    expect(fill).toHaveBeenCalledTimes(1);
  });
});

describe('useDialogForm', () => {
  test('should fill on opening and hand FormDialog the model, the rules read late, the submission and save', async () => {
    const open = ref(false);
    const model = { name: '' };
    const fill = vi.fn(() => void (model.name = 'Alder Green'));
    const save = vi.fn(async () => undefined);
    const late: { rules?: { name: { required: boolean }[] } } = {};
    const dialog = useDialogForm(open, { model, row: () => null, fill, rules: () => late.rules, save });
    const rules = { name: [{ required: true }] };
    late.rules = rules;
    open.value = true;
    await Promise.resolve();
    expect(fill).toHaveBeenCalledTimes(1);
    expect(dialog.form.value).toEqual({ model: { name: 'Alder Green' }, rules, submission: dialog.submission, save });
    expect(dialog.serverErrors).toBe(dialog.submission.serverErrors);
  });
});

describe('useDialogForm words', () => {
  test('should give FormDialog the words of creating without a row and of editing with one, and follow the row', () => {
    const row = ref<{ name: string } | null>(null);
    const words = {
      create: () => ({ title: 'New site', submitLabel: 'Add site', savedMessage: 'Site added.' }),
      edit: (s: { name: string }) => ({ title: `Edit ${s.name}`, savedMessage: `${s.name} saved.` }),
    };
    const dialog = useDialogForm(ref(false), { model: {}, row: () => row.value, fill: () => undefined, save: async () => undefined, words });
    const said = () => ({ title: dialog.form.value.title, submitLabel: dialog.form.value.submitLabel, savedMessage: dialog.form.value.savedMessage });
    expect(said()).toEqual({ title: 'New site', submitLabel: 'Add site', savedMessage: 'Site added.' });
    row.value = { name: 'Alder Green' };
    expect(said()).toEqual({ title: 'Edit Alder Green', submitLabel: undefined, savedMessage: 'Alder Green saved.' });
  });
});
