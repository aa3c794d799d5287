import type { Action, Role, SubjectName } from '@swardwise/domain';
import type { RouteMeta, RouteRecordRaw, RouteRecordSingleView } from 'vue-router';
import { useSessionStore } from '../stores/session.ts';
import { FIELD_STAFF, OFFICE } from '../utils/roleGroups.ts';

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: true;
    /** The ability check of the page. */
    can?: [Action, SubjectName];
    /** The roles whose work this page is; others are sent to their own landing page. */
    roles?: readonly Role[];
    title?: string;
  }
}

/**
 * One page's route: its path, its name, its view (loaded when first shown) and its meta (who
 * may open it, its title); `more` for what only a few pages have (props, a beforeEnter).
 */
function page(path: string, name: string, component: RouteRecordSingleView['component'], meta: RouteMeta, more: Pick<RouteRecordSingleView, 'props' | 'beforeEnter'> = {}): RouteRecordRaw {
  return { path, name, component, meta, ...more };
}

export const routes: RouteRecordRaw[] = [
  page('/sign-in', 'sign-in', () => import('../views/SignInView.vue'), { public: true, title: 'Sign in' }),
  page('/accept-invite', 'accept-invite', () => import('../views/AcceptInviteView.vue'), { public: true, title: 'Set your password' }),
  page('/reset-password', 'reset-password', () => import('../views/AcceptInviteView.vue'), { public: true, title: 'Choose a new password' }, { props: { purpose: 'reset' } }),
  page('/forgot-password', 'forgot-password', () => import('../views/ForgotPasswordView.vue'), { public: true, title: 'Forgot your password' }),
  // The public status board: no sign-in, no portal frame; players and parents read it on a phone.
  page('/status', 'status', () => import('../views/StatusView.vue'), { public: true, title: 'Field status' }),
  // Printed and taken to the field: no portal frame around it.
  page('/week/sheet', 'crew-sheet', () => import('../views/CrewSheetView.vue'), { roles: OFFICE, can: ['read', 'WorkOrder'], title: 'Crew sheet' }),
  {
    path: '/',
    component: () => import('../layouts/AppLayout.vue'),
    children: [
      // Each role has its own landing page; before the session is known, that is sign-in.
      { path: '', name: 'home', redirect: () => useSessionStore().landing },
      // A foreman reaches his own district's overview from My district.
      page('overview', 'overview', () => import('../views/OverviewView.vue'), { roles: OFFICE, can: ['read', 'Overview'], title: 'Overview' }),
      page('district', 'district', () => import('../views/DistrictView.vue'), { roles: ['foreman'], can: ['read', 'District'], title: 'My district' }),
      page('today', 'today', () => import('../views/TodayView.vue'), { roles: ['crew'], can: ['read', 'Crew'], title: 'Today' }),
      page('requests', 'requests', () => import('../views/RequestsView.vue'), { roles: [...OFFICE, 'partner'], can: ['read', 'Request'], title: 'Requests' }),
      page('my-fields', 'my-fields', () => import('../views/MyFieldsView.vue'), { roles: ['partner'], can: ['read', 'Field'], title: 'My fields' }),
      // The partner's own page of a field: a different page from the staff's, in plain words.
      page('my-fields/:id(\\d+)', 'my-field', () => import('../views/PartnerFieldView.vue'), { roles: ['partner'], can: ['read', 'PartnerView'], title: 'My field' }),
      page('sites', 'sites', () => import('../views/SitesView.vue'), { roles: OFFICE, can: ['read', 'Site'], title: 'Sites' }),
      page('sites/:id(\\d+)', 'site', () => import('../views/SiteView.vue'), { can: ['read', 'Site'], title: 'Site' }),
      page('fields', 'fields', () => import('../views/FieldsView.vue'), { roles: FIELD_STAFF, can: ['read', 'Field'], title: 'Fields' }),
      page('fields/:id(\\d+)', 'field', () => import('../views/FieldView.vue'), { can: ['read', 'Field'], title: 'Field' }, {
        // A partner following an old link to the staff page gets his own page of the field.
        beforeEnter: (to) => (useSessionStore().user?.role === 'partner' ? { name: 'my-field', params: { id: to.params.id } } : true),
      }),
      page('fields/:id(\\d+)/lines', 'field-lines', () => import('../views/FieldLinesView.vue'), { roles: FIELD_STAFF, can: ['read', 'Field'], title: 'Line plan' }),
      page('fields/:id(\\d+)/logos', 'field-logos', () => import('../views/FieldLogosView.vue'), { roles: FIELD_STAFF, can: ['read', 'Field'], title: 'Logos' }),
      page('crews', 'crews', () => import('../views/CrewsView.vue'), { roles: OFFICE, can: ['read', 'Crew'], title: 'Crews' }),
      page('equipment', 'equipment', () => import('../views/EquipmentView.vue'), { roles: OFFICE, can: ['read', 'Equipment'], title: 'Equipment' }),
      page('weather', 'weather', () => import('../views/WeatherView.vue'), { roles: OFFICE, can: ['read', 'Weather'], title: 'Weather' }),
      page('standards', 'standards', () => import('../views/StandardsView.vue'), { can: ['read', 'Standards'], title: 'Standards' }),
      page('costs', 'costs', () => import('../views/CostsView.vue'), { roles: OFFICE, can: ['read', 'CostSettings'], title: 'Costs and rates' }),
      page('budget', 'budget', () => import('../views/BudgetView.vue'), { roles: OFFICE, can: ['read', 'Budget'], title: 'Season budget' }),
      page('what-if', 'what-if', () => import('../views/WhatIfView.vue'), { roles: OFFICE, can: ['read', 'Budget'], title: 'What if' }),
      page('compare', 'compare', () => import('../views/CompareView.vue'), { roles: OFFICE, can: ['read', 'SiteComparison'], title: 'Compare sites' }),
      page('map', 'map', () => import('../views/MapView.vue'), { roles: [...FIELD_STAFF, 'partner'], can: ['read', 'Field'], title: 'Map' }),
      page('week', 'week', () => import('../views/WeekPlanView.vue'), { roles: OFFICE, can: ['read', 'WorkOrder'], title: 'Week plan' }),
      page('records', 'records', () => import('../views/RecordsView.vue'), { roles: OFFICE, can: ['read', 'WorkOrder'], title: 'Records' }),
      page('imports', 'imports', () => import('../views/ImportsView.vue'), { roles: OFFICE, can: ['create', 'Import'], title: 'Imports' }),
      page('admin/users', 'users', () => import('../views/UsersView.vue'), { roles: ['admin'], can: ['create', 'User'], title: 'Users' }),
      page('audit', 'audit', () => import('../views/AuditView.vue'), { roles: ['admin', 'head'], can: ['read', 'AuditEntry'], title: 'Audit log' }),
      page('mail-outbox', 'mail-outbox', () => import('../views/MailOutboxView.vue'), { roles: ['admin', 'head'], can: ['read', 'MailOutbox'], title: 'Mail outbox' }),
      // Development only: the API answers it when it runs the local mail sink.
      page('dev/mail', 'dev-mail', () => import('../views/DevMailView.vue'), { roles: ['admin'], can: ['manage', 'Settings'], title: 'Development mail' }),
      page(':pathMatch(.*)*', 'not-found', () => import('../views/NotFoundView.vue'), { title: 'Not found' }),
    ],
  },
];
