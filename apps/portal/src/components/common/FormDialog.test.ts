import { ElFormItem, ElInput } from 'element-plus';
import { describe, expect, test, vi } from 'vitest';
import { defineComponent, h, reactive, ref } from 'vue';
import { ApiError } from '../../api/client.ts';
import { useFormSubmit } from '../../composables/useFormSubmit.ts';
import { $, cleanUpAfterEach, errorsShown, mountDialog, submitDialog, type } from '../../testing/dialogs.ts';
import FormDialog from './FormDialog.vue';

/** A page holding a one-field dialog, as the form dialogs use it. */
async function host(save: () => Promise<unknown>, closeOnSave = true) {
  const open = ref(true);
  const reloads = vi.fn();
  const Host = defineComponent(() => {
    const model = reactive({ name: '' });
    const submission = useFormSubmit();
    const rules = { name: [{ required: true, message: 'enter a name', trigger: 'blur' }] };
    return () =>
      h(
        FormDialog,
        { open: open.value, 'onUpdate:open': (v: boolean) => (open.value = v), title: 'New thing', test: 'thing', model, rules, submission, save, closeOnSave, onReload: reloads },
        () => h(ElFormItem, { label: 'Name', prop: 'name' }, () => h(ElInput, { modelValue: model.name, 'onUpdate:modelValue': (v: string) => (model.name = v), 'data-test': 'thing-name' })),
      );
  });
  return { wrapper: await mountDialog(Host, {}), open, reloads };
}

cleanUpAfterEach();

describe('FormDialog', () => {
  test('should check the form with its rules and save nothing while it is invalid', async () => {
    const save = vi.fn(async () => undefined);
    const { wrapper, open } = await host(save);
    await submitDialog('thing');
    await vi.waitFor(() => expect(errorsShown()).toEqual(['enter a name']));
    expect(save).not.toHaveBeenCalled();
    expect(open.value).toBe(true);
    wrapper.unmount();
  });

  test('should save a valid form once and close', async () => {
    const save = vi.fn(async () => undefined);
    const { wrapper, open } = await host(save);
    await type('[data-test="thing-name"]', 'Alder');
    await submitDialog('thing');
    expect(save).toHaveBeenCalledTimes(1);
    expect(open.value).toBe(false);
    wrapper.unmount();
  });

  test('should stay open after saving when it shows a result', async () => {
    const { wrapper, open } = await host(async () => undefined, false);
    await type('[data-test="thing-name"]', 'Alder');
    await submitDialog('thing');
    expect(open.value).toBe(true);
    wrapper.unmount();
  });

  test('should show a failed save above the form and offer Reload after a conflict', async () => {
    const { wrapper, open, reloads } = await host(() => Promise.reject(new ApiError(409, 'site/version_conflict', 'stale')));
    await type('[data-test="thing-name"]', 'Alder');
    await submitDialog('thing');
    expect($('[data-test="thing-form-error"]')?.textContent).toMatch(/Someone else changed this site/);
    expect(open.value).toBe(true);
    ($('[data-test="thing-form-reload"]') as HTMLButtonElement).click();
    expect(reloads).toHaveBeenCalledTimes(1);
    wrapper.unmount();
  });

  test('should show a refused save without Reload', async () => {
    const { wrapper } = await host(() => Promise.reject(new ApiError(400, 'request/invalid', 'No such district')));
    await type('[data-test="thing-name"]', 'Alder');
    await submitDialog('thing');
    expect($('[data-test="thing-form-error"]')?.textContent).toContain('No such district');
    expect($('[data-test="thing-form-reload"]')).toBeNull();
    wrapper.unmount();
  });
});
