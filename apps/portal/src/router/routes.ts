import type { Action, Role, SubjectName } from '@swardwise/domain';
import type { RouteRecordRaw } from 'vue-router';
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

export const routes: RouteRecordRaw[] = [
  { path: '/sign-in', name: 'sign-in', component: () => import('../views/SignInView.vue'), meta: { public: true, title: 'Sign in' } },
  {
    path: '/accept-invite',
    name: 'accept-invite',
    component: () => import('../views/AcceptInviteView.vue'),
    meta: { public: true, title: 'Set your password' },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('../views/AcceptInviteView.vue'),
    props: { purpose: 'reset' },
    meta: { public: true, title: 'Choose a new password' },
  },
  {
    path: '/forgot-password',
    name: 'forgot-password',
    component: () => import('../views/ForgotPasswordView.vue'),
    meta: { public: true, title: 'Forgot your password' },
  },
  {
    // The public status board: no sign-in, no portal frame; players and parents read it on a phone.
    path: '/status',
    name: 'status',
    component: () => import('../views/StatusView.vue'),
    meta: { public: true, title: 'Field status' },
  },
  {
    // Printed and taken to the field: no portal frame around it.
    path: '/week/sheet',
    name: 'crew-sheet',
    component: () => import('../views/CrewSheetView.vue'),
    meta: { roles: OFFICE, can: ['read', 'WorkOrder'], title: 'Crew sheet' },
  },
  {
    path: '/',
    component: () => import('../layouts/AppLayout.vue'),
    children: [
      // Each role has its own landing page; before the session is known, that is sign-in.
      { path: '', name: 'home', redirect: () => useSessionStore().landing },
      {
        path: 'overview',
        name: 'overview',
        component: () => import('../views/OverviewView.vue'),
        // A foreman reaches his own district's overview from My district.
        meta: { roles: OFFICE, can: ['read', 'Overview'], title: 'Overview' },
      },
      {
        path: 'district',
        name: 'district',
        component: () => import('../views/DistrictView.vue'),
        meta: { roles: ['foreman'], can: ['read', 'District'], title: 'My district' },
      },
      {
        path: 'today',
        name: 'today',
        component: () => import('../views/TodayView.vue'),
        meta: { roles: ['crew'], can: ['read', 'Crew'], title: 'Today' },
      },
      {
        path: 'requests',
        name: 'requests',
        component: () => import('../views/RequestsView.vue'),
        meta: { roles: [...OFFICE, 'partner'], can: ['read', 'Request'], title: 'Requests' },
      },
      {
        path: 'my-fields',
        name: 'my-fields',
        component: () => import('../views/MyFieldsView.vue'),
        meta: { roles: ['partner'], can: ['read', 'Field'], title: 'My fields' },
      },
      {
        // The partner's own page of a field: a different page from the staff's, in plain words.
        path: 'my-fields/:id(\\d+)',
        name: 'my-field',
        component: () => import('../views/PartnerFieldView.vue'),
        meta: { roles: ['partner'], can: ['read', 'PartnerView'], title: 'My field' },
      },
      {
        path: 'sites',
        name: 'sites',
        component: () => import('../views/SitesView.vue'),
        meta: { roles: OFFICE, can: ['read', 'Site'], title: 'Sites' },
      },
      {
        path: 'sites/:id(\\d+)',
        name: 'site',
        component: () => import('../views/SiteView.vue'),
        meta: { can: ['read', 'Site'], title: 'Site' },
      },
      {
        path: 'fields',
        name: 'fields',
        component: () => import('../views/FieldsView.vue'),
        meta: { roles: FIELD_STAFF, can: ['read', 'Field'], title: 'Fields' },
      },
      {
        path: 'fields/:id(\\d+)',
        name: 'field',
        component: () => import('../views/FieldView.vue'),
        // A partner following an old link to the staff page gets his own page of the field.
        beforeEnter: (to) => (useSessionStore().user?.role === 'partner' ? { name: 'my-field', params: { id: to.params.id } } : true),
        meta: { can: ['read', 'Field'], title: 'Field' },
      },
      {
        path: 'fields/:id(\\d+)/lines',
        name: 'field-lines',
        component: () => import('../views/FieldLinesView.vue'),
        meta: { roles: FIELD_STAFF, can: ['read', 'Field'], title: 'Line plan' },
      },
      {
        path: 'fields/:id(\\d+)/logos',
        name: 'field-logos',
        component: () => import('../views/FieldLogosView.vue'),
        meta: { roles: FIELD_STAFF, can: ['read', 'Field'], title: 'Logos' },
      },
      {
        path: 'crews',
        name: 'crews',
        component: () => import('../views/CrewsView.vue'),
        meta: { roles: OFFICE, can: ['read', 'Crew'], title: 'Crews' },
      },
      {
        path: 'equipment',
        name: 'equipment',
        component: () => import('../views/EquipmentView.vue'),
        meta: { roles: OFFICE, can: ['read', 'Equipment'], title: 'Equipment' },
      },
      {
        path: 'weather',
        name: 'weather',
        component: () => import('../views/WeatherView.vue'),
        meta: { roles: OFFICE, can: ['read', 'Weather'], title: 'Weather' },
      },
      {
        path: 'standards',
        name: 'standards',
        component: () => import('../views/StandardsView.vue'),
        meta: { can: ['read', 'Standards'], title: 'Standards' },
      },
      {
        path: 'costs',
        name: 'costs',
        component: () => import('../views/CostsView.vue'),
        meta: { roles: OFFICE, can: ['read', 'CostSettings'], title: 'Costs and rates' },
      },
      {
        path: 'budget',
        name: 'budget',
        component: () => import('../views/BudgetView.vue'),
        meta: { roles: OFFICE, can: ['read', 'Budget'], title: 'Season budget' },
      },
      {
        path: 'what-if',
        name: 'what-if',
        component: () => import('../views/WhatIfView.vue'),
        meta: { roles: OFFICE, can: ['read', 'Budget'], title: 'What if' },
      },
      {
        path: 'compare',
        name: 'compare',
        component: () => import('../views/CompareView.vue'),
        meta: { roles: OFFICE, can: ['read', 'SiteComparison'], title: 'Compare sites' },
      },
      {
        path: 'map',
        name: 'map',
        component: () => import('../views/MapView.vue'),
        meta: { roles: [...FIELD_STAFF, 'partner'], can: ['read', 'Field'], title: 'Map' },
      },
      {
        path: 'week',
        name: 'week',
        component: () => import('../views/WeekPlanView.vue'),
        meta: { roles: OFFICE, can: ['read', 'WorkOrder'], title: 'Week plan' },
      },
      {
        path: 'records',
        name: 'records',
        component: () => import('../views/RecordsView.vue'),
        meta: { roles: OFFICE, can: ['read', 'WorkOrder'], title: 'Records' },
      },
      {
        path: 'imports',
        name: 'imports',
        component: () => import('../views/ImportsView.vue'),
        meta: { roles: OFFICE, can: ['create', 'Import'], title: 'Imports' },
      },
      {
        path: 'admin/users',
        name: 'users',
        component: () => import('../views/UsersView.vue'),
        meta: { roles: ['admin'], can: ['create', 'User'], title: 'Users' },
      },
      {
        path: 'audit',
        name: 'audit',
        component: () => import('../views/AuditView.vue'),
        meta: { roles: ['admin', 'head'], can: ['read', 'AuditEntry'], title: 'Audit log' },
      },
      {
        path: 'mail-outbox',
        name: 'mail-outbox',
        component: () => import('../views/MailOutboxView.vue'),
        meta: { roles: ['admin', 'head'], can: ['read', 'MailOutbox'], title: 'Mail outbox' },
      },
      {
        // Development only: the API answers it when it runs the local mail sink.
        path: 'dev/mail',
        name: 'dev-mail',
        component: () => import('../views/DevMailView.vue'),
        meta: { roles: ['admin'], can: ['manage', 'Settings'], title: 'Development mail' },
      },
      { path: ':pathMatch(.*)*', name: 'not-found', component: () => import('../views/NotFoundView.vue'), meta: { title: 'Not found' } },
    ],
  },
];
