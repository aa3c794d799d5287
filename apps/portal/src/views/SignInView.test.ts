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
/** The answers of the two endpoints the page calls: the public config (on load) and sign-in. */
let configAnswer: () => Response;
let signInAnswer: (() => Response) | null;
const signInCalls = () => fetchMock.mock.calls.filter(([url]) => String(url) === '/api/auth/sign-in');

beforeEach(() => {
  fetchMock.mockReset();
  configAnswer = () => jsonResponse(200, { demo: null });
  signInAnswer = null;
  fetchMock.mockImplementation(async (input) => {
    const url = String(input);
    if (url === '/api/config') return configAnswer();
    if (url === '/api/auth/sign-in' && signInAnswer) return signInAnswer();
    throw new Error(`unexpected request ${url}`);
  });
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
    expect(signInCalls()).toHaveLength(0);
  });

  test('should reject a malformed e-mail address with the schema’s message', async () => {
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'head-at-swardwise', 'secret');
    expect(wrapper.findAll('.el-form-item__error').map((e) => e.text())).toEqual(['enter a valid e-mail address']);
    expect(signInCalls()).toHaveLength(0);
  });

  test('should ask for the password when only the e-mail is given', async () => {
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'head@swardwise.example', '');
    expect(wrapper.findAll('.el-form-item__error').map((e) => e.text())).toEqual(['enter your password']);
  });

  test('should say clearly that the credentials were wrong on a 401', async () => {
    signInAnswer = () => jsonResponse(401, { error: { code: 'auth/invalid_credentials', message: 'invalid e-mail or password' } });
    const { wrapper } = await mountSignIn();
    await submit(wrapper, ' Head@Swardwise.example ', 'wrong-password');
    const [url, init] = signInCalls()[0]!;
    expect(url).toBe('/api/auth/sign-in');
    expect(JSON.parse(init!.body as string)).toEqual({ email: 'head@swardwise.example', password: 'wrong-password' });
    expect(wrapper.get('[data-test="sign-in-error"]').text()).toContain('The e-mail or password is not right');
  });

  test('should say why the last session ended when an administrator changed the access', async () => {
    const { wrapper } = await mountSignIn();
    const { useSessionStore } = await import('../stores/session.ts');
    const { ApiError } = await import('../api/client.ts');
    useSessionStore().expire(new ApiError(401, 'auth/access_changed', 'changed'));
    await flushPromises();
    expect(wrapper.get('[data-test="sign-in-notice"]').text()).toMatch(/An administrator changed your account’s access, which signed you out/);
  });

  test('should tell a deactivated account so after the right password', async () => {
    signInAnswer = () => jsonResponse(403, { error: { code: 'auth/deactivated', message: 'deactivated' } });
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'gone@swardwise.example', 'right-password');
    expect(wrapper.get('[data-test="sign-in-error"]').text()).toContain('This account has been deactivated');
  });

  test('should tell the user to wait when sign-in is rate limited', async () => {
    signInAnswer = () => jsonResponse(429, { error: { code: 'auth/rate_limited', message: 'slow down' } });
    const { wrapper } = await mountSignIn();
    await submit(wrapper, 'head@swardwise.example', 'whatever1');
    expect(wrapper.get('[data-test="sign-in-error"]').text()).toContain('Wait a few minutes');
  });

  test('should go to the role’s landing page after signing in', async () => {
    signInAnswer = () =>
      jsonResponse(200, {
        user: { id: 3, email: 'f@swardwise.example', name: 'Fay', role: 'foreman', districtId: 1, crewId: null, siteIds: [], units: 'imperial', version: 1 },
      });
    const { wrapper, router } = await mountSignIn();
    await submit(wrapper, 'f@swardwise.example', 'right-password');
    expect(router.currentRoute.value.path).toBe('/district');
  });

  test('should show no demo notice outside demo mode, nor when the config cannot be read', async () => {
    const { wrapper } = await mountSignIn();
    await flushPromises();
    expect(wrapper.find('[data-test="demo-notice"]').exists()).toBe(false);
    configAnswer = () => jsonResponse(500, { error: { code: 'server/internal', message: 'down' } });
    const again = await mountSignIn();
    await flushPromises();
    expect(again.wrapper.find('[data-test="demo-notice"]').exists()).toBe(false);
  });

  test('should announce the invented demo city with its sign-ins, and fill one in on request', async () => {
    configAnswer = () =>
      jsonResponse(200, {
        demo: {
          city: 'Sallowmere',
          note: 'Invented demo city.',
          signIns: [
            { role: 'admin', label: 'Administrator', email: 'admin@swardwise.example', password: 'demo-admin-2026' },
            { role: 'head', label: 'Department head', email: 'head@swardwise.example', password: 'demo-head-2026' },
          ],
        },
      });
    const { wrapper } = await mountSignIn();
    await flushPromises();
    const notice = wrapper.get('[data-test="demo-notice"]');
    expect(notice.get('h2').text()).toBe('Demo city — invented data');
    expect(notice.text()).toContain('Sallowmere');
    expect(notice.text()).toContain('README');
    expect(notice.text()).toContain('head@swardwise.example');
    expect(notice.text()).toContain('password demo-head-2026');
    await wrapper.get('[data-test="demo-use-head"]').trigger('click');
    expect((wrapper.get('input[data-test="email"]').element as HTMLInputElement).value).toBe('head@swardwise.example');
    expect((wrapper.get('input[data-test="password"]').element as HTMLInputElement).value).toBe('demo-head-2026');
    expect(signInCalls()).toHaveLength(0);
  });
});
