import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import SignInView from './SignInView.vue';

function jsonResponse(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

async function mountSignIn() {
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/sign-in', component: SignInView },
      { path: '/:any(.*)*', component: { template: '<div />' } },
    ],
  });
  await router.push('/sign-in');
  const wrapper = mount(SignInView, { global: { plugins: [ElementPlus, pinia, router] }, attachTo: document.body });
  return { wrapper, router };
}

async function submit(wrapper: Awaited<ReturnType<typeof mountSignIn>>['wrapper'], email: string, password: string) {
  await wrapper.get('input[data-test="email"]').setValue(email);
  await wrapper.get('input[data-test="password"]').setValue(password);
  await wrapper.get('form').trigger('submit');
  await flushPromises();
  // Element Plus shows a field's error 100 ms after the state changes.
  await new Promise((r) => setTimeout(r, 150));
  await flushPromises();
}

const fetchMock = vi.fn<typeof fetch>();

beforeEach(() => {
  fetchMock.mockReset();
  vi.stubGlobal('fetch', fetchMock);
});

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('SignInView', () => {
  test('should ask for an e-mail address when it is empty and not call the API', async () => {
    const { wrapper } = await mountSignIn();
    await submit(wrapper, '', 'secret');
    expect(wrapper.text()).toContain('enter a valid e-mail address');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  test('should reject a malformed e-mail address with the schema’s message', async () => {
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'head-at-swardwise', 'secret');
    expect(wrapper.findAll('.el-form-item__error').map((e) => e.text())).toEqual(['enter a valid e-mail address']);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  test('should ask for the password when only the e-mail is given', async () => {
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'head@swardwise.example', '');
    expect(wrapper.findAll('.el-form-item__error').map((e) => e.text())).toEqual(['enter your password']);
  });

  test('should say clearly that the credentials were wrong on a 401', async () => {
    fetchMock.mockResolvedValueOnce(
      jsonResponse(401, { error: { code: 'auth/invalid_credentials', message: 'invalid e-mail or password' } }),
    );
    const { wrapper } = await mountSignIn();
    await submit(wrapper, ' Head@Swardwise.example ', 'wrong-password');
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(url).toBe('/api/auth/sign-in');
    expect(JSON.parse(init!.body as string)).toEqual({ email: 'head@swardwise.example', password: 'wrong-password' });
    expect(wrapper.get('[data-test="sign-in-error"]').text()).toContain('The e-mail or password is not right');
  });

  test('should tell the user to wait when sign-in is rate limited', async () => {
    fetchMock.mockResolvedValueOnce(jsonResponse(429, { error: { code: 'auth/rate_limited', message: 'slow down' } }));
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'head@swardwise.example', 'whatever1');
    expect(wrapper.get('[data-test="sign-in-error"]').text()).toContain('Wait a few minutes');
  });

  test('should go to the role’s landing page after signing in', async () => {
    fetchMock.mockResolvedValueOnce(
      jsonResponse(200, {
        user: { id: 3, email: 'f@swardwise.example', name: 'Fay', role: 'foreman', districtId: 1, crewId: null, siteIds: [], units: 'imperial', version: 1 },
      }),
    );
    const { wrapper, router } = await mountSignIn();
    await submit(wrapper, 'f@swardwise.example', 'right-password');
    expect(router.currentRoute.value.path).toBe('/district');
  });
});
