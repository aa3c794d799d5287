import { useAbility } from '@casl/vue';
import { asSubject, type AppAbility, type DistrictRow } from '@swardwise/domain';
import { computed, ref, shallowRef, watch, type Ref } from 'vue';
import { rowOptions } from '../utils/options.ts';
import type { QueryState } from './useApiQuery.ts';
import type { FormSubmit } from './useFormSubmit.ts';

/**
 * A create-or-edit dialog starts afresh each time it opens (and when the row it edits changes
 * while open): `fill` puts the row, or an empty model, into the form; the last errors and
 * validation marks go.
 */
export function resetOnOpen(open: Ref<boolean>, row: () => unknown, fill: () => void, submission: Pick<FormSubmit, 'clear' | 'form'>): void {
  watch(
    [row, open],
    ([, isOpen]) => {
      if (!isOpen) return;
      fill();
      submission.clear();
      submission.form.value?.clearValidate();
    },
    { immediate: true },
  );
}

/**
 * The districts a person may put a new row of `subject` in (a foreman: his own), for a
 * dialog's District select. A new row gets the district when there is only one to choose;
 * `districtItem` is the select's label, options and lock, for `<SelectItem v-bind>`.
 */
export function useDistrictChoice(subject: 'Site' | 'Crew' | 'Equipment', districts: () => readonly DistrictRow[], model: { districtId: number | null }, isNew: () => boolean) {
  const ability = useAbility<AppAbility>();
  const districtOptions = computed(() => districts().filter((d) => ability.can('create', asSubject(subject, { districtId: d.id }))));
  function pickOnly() {
    const only = districtOptions.value.length === 1 ? districtOptions.value[0]! : null;
    if (only && isNew() && model.districtId === null) model.districtId = only.id;
  }
  watch(districtOptions, pickOnly);
  const districtItem = computed(() => ({
    label: 'District',
    prop: 'districtId',
    placeholder: 'Choose a district',
    options: rowOptions(districtOptions.value),
    disabled: districtOptions.value.length <= 1 && !!model.districtId,
  }));
  return { districtOptions, districtItem, pickOnly };
}

/**
 * A page's create-or-edit dialog over a list: which row it edits (null: a new one), and the
 * Reload a version conflict offers, which reads the list again and edits the fresh row.
 */
export function useEditDialog<T extends { id: number }>(list: Pick<QueryState<readonly T[]>, 'data' | 'refetch'>) {
  const open = ref(false);
  const editing = shallowRef<T | null>(null);
  function edit(row: T | null) {
    editing.value = row;
    open.value = true;
  }
  async function reloadEditing() {
    await list.refetch();
    editing.value = list.data.value?.find((r) => r.id === editing.value?.id) ?? null;
  }
  return { open, editing, edit, reloadEditing };
}
