/**
 * What the form dialogs' component tests share. Element Plus teleports a dialog to the page's
 * body, so these read `document.body`, not the wrapper.
 */
import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor, type DistrictRow, type Polygon } from '@swardwise/domain';
import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia, type Pinia } from 'pinia';
import { afterEach, expect, vi } from 'vitest';
import type { Component } from 'vue';

export const $ = (sel: string) => document.body.querySelector(sel);
export const errorsShown = () => [...document.body.querySelectorAll('.el-form-item__error')].map((e) => e.textContent?.trim());
export const labelsShown = () => [...document.body.querySelectorAll('.el-form-item__label')].map((e) => e.textContent?.trim());
/** Waits until the form shows each of `expected` under its field, and `count` messages in all. */
export async function waitForErrors(expected: string[], count = expected.length) {
  await vi.waitFor(() => {
    const shown = errorsShown();
    for (const message of expected) expect(shown).toContain(message);
    expect(shown).toHaveLength(count);
  });
}

const boundary: Polygon = { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] };
export const district = (id: number, name: string): DistrictRow => ({ id, code: name.toLowerCase(), name, boundary, yard: { name: 'Yard', lat: 0, lng: 0 }, version: 1, siteCount: 0, fieldCount: 0, fieldAreaM2: 0 });
export const FOREMAN_NORTH: Actor = { id: 3, role: 'foreman', districtId: 1, crewId: null, siteIds: [] };

/**
 * Mounts a dialog open, with Element Plus, a store and, given an actor, the actor's abilities,
 * and waits until it has settled. Given `fetch`, the page's fetch is that stand-in from before
 * the dialog mounts (`cleanUpAfterEach` restores it); `plugins` are any more the dialog needs.
 */
export async function mountDialog(component: Component, props: Record<string, unknown>, options: { actor?: Actor; pinia?: Pinia; fetch?: (...args: never[]) => unknown; plugins?: unknown[] } = {}) {
  if (options.fetch) vi.stubGlobal('fetch', options.fetch);
  const plugins: unknown[] = [ElementPlus, options.pinia ?? createPinia(), ...(options.plugins ?? [])];
  if (options.actor) plugins.push([abilitiesPlugin, defineAbilityFor(options.actor)]);
  const wrapper = mount(component, { props: { open: true, ...props }, global: { plugins: plugins as never }, attachTo: document.body });
  await flushPromises();
  return wrapper;
}

export type DialogWrapper = Awaited<ReturnType<typeof mountDialog>>;

/** Types into an Element Plus input (the data-test on the input or on its wrapper) and leaves it. */
export async function type(sel: string, value: string) {
  const input = $(`${sel} input, input${sel}`) as HTMLInputElement;
  input.value = value;
  input.dispatchEvent(new Event('input'));
  input.dispatchEvent(new Event('change'));
  input.dispatchEvent(new FocusEvent('blur'));
  await flushPromises();
}

/** Clicks a dialog's submit button (`<test>-submit`) and waits out validation and the request. */
export async function submitDialog(test: string) {
  ($(`[data-test="${test}-submit"]`) as HTMLButtonElement).click();
  await flushPromises();
  await new Promise((r) => setTimeout(r, 0));
  await flushPromises();
}

/** What a dialog says: its title and its submit button's label. */
export const dialogWords = (test: string) => ({
  title: $(`[data-test="${test}-dialog"] .el-dialog__title`)?.textContent?.trim(),
  submitLabel: $(`[data-test="${test}-submit"]`)?.textContent?.trim(),
});

/** A fetch stand-in answering every call with `body` as JSON. */
export const answering = (status: number, body: unknown) => vi.fn(async (_url: string, _init?: RequestInit) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } }));

/** After each test of the file: the page emptied, fetch restored. */
export function cleanUpAfterEach() {
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });
}
