import { useAbility } from '@casl/vue';
import { asSubject, type AppAbility, type DistrictRow } from '@swardwise/domain';
import type { FormRules } from 'element-plus';
import { computed, ref, shallowRef, toValue, watch, type ComputedRef, type MaybeRefOrGetter, type Ref } from 'vue';
import { rowOptions } from '../utils/options.ts';
import type { QueryState } from './useApiQuery.ts';
import { useFormSubmit, type FormSubmit, type FormSubmitOptions } from './useFormSubmit.ts';

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

/** What a form dialog says: its title, its submit button (FormDialog's "Save" when left out) and the line said once saved. */
export interface DialogWords {
  title: string;
  submitLabel?: string;
  savedMessage?: string;
}

/**
 * The words of a create-or-edit dialog, each case written once: `create` when there is no row
 * to edit, `edit` with the row being edited.
 */
export interface CreateOrEditWords<R> {
  create: () => DialogWords;
  edit: (row: NonNullable<R>) => DialogWords;
}

/** What `useDialogForm` is told: the form's model, how to fill it, its rules, how to save it. */
interface DialogFormSetup<R> {
  model: object;
  row: () => R;
  fill: () => void;
  rules?: MaybeRefOrGetter<FormRules | undefined>;
  save: () => Promise<unknown>;
  options?: FormSubmitOptions;
}

/** What FormDialog takes of a form: `<FormDialog v-bind="form">`. */
interface FormBinding {
  model: object;
  rules: FormRules | undefined;
  submission: FormSubmit;
  save: () => Promise<unknown>;
}

interface DialogForm<F> {
  submission: FormSubmit;
  serverErrors: FormSubmit['serverErrors'];
  form: ComputedRef<F>;
}

/**
 * A form dialog's form: its submit cycle (`useFormSubmit(options)`), the model filled afresh
 * each time the dialog opens (`resetOnOpen` with `row` and `fill`), and `form`, what FormDialog
 * needs of it — model, rules, submission and save — for `<FormDialog v-bind="form">`. `rules`
 * may be a getter, read when the dialog renders, for rules declared further down. Given
 * `words`, `form` also carries the title, submit label and saved message of the case the
 * dialog is in: editing `row()`, or creating when it is null.
 */
export function useDialogForm<R>(open: Ref<boolean>, setup: DialogFormSetup<R> & { words: CreateOrEditWords<R> }): DialogForm<FormBinding & DialogWords>;
export function useDialogForm<R>(open: Ref<boolean>, setup: DialogFormSetup<R>): DialogForm<FormBinding>;
export function useDialogForm<R>(open: Ref<boolean>, setup: DialogFormSetup<R> & { words?: CreateOrEditWords<R> }): DialogForm<FormBinding & Partial<DialogWords>> {
  const submission = useFormSubmit(setup.options);
  resetOnOpen(open, setup.row, setup.fill, submission);
  const words = (): DialogWords | undefined => {
    if (!setup.words) return undefined;
    const row = setup.row();
    return row == null ? setup.words.create() : setup.words.edit(row);
  };
  const form = computed(() => ({ model: setup.model, rules: toValue(setup.rules), submission, save: setup.save, ...words() }));
  return { submission, serverErrors: submission.serverErrors, form };
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
