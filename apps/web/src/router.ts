import type { Action, Subject } from '@busbar/shared';
import { createRouter, createWebHistory, type RouteLocationNormalized } from 'vue-router';
import { homeOf } from './layout/home.ts';
import { ability, useSessionStore } from './stores/session.ts';

declare module 'vue-router' {
  interface RouteMeta {
    /** Open without signing in. */
    public?: true;
    /** What the person must be able to do to open the page. */
    action?: Action;
    subject?: Subject;
    title?: string;
  }
}

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    { path: '/sign-in', name: 'sign-in', component: () => import('./views/SignIn.vue'), meta: { public: true, title: 'Sign in' } },
    {
      path: '/set-password',
      name: 'set-password',
      component: () => import('./views/SetPassword.vue'),
      props: { purpose: 'invite' },
      meta: { public: true, title: 'Set your password' },
    },
    {
      path: '/forgot-password',
      name: 'forgot-password',
      component: () => import('./views/ForgotPassword.vue'),
      meta: { public: true, title: 'Forgot your password?' },
    },
    {
      path: '/reset-password',
      name: 'reset-password',
      component: () => import('./views/SetPassword.vue'),
      props: { purpose: 'reset' },
      meta: { public: true, title: 'Choose a new password' },
    },
    {
      path: '/',
      component: () => import('./layout/AppLayout.vue'),
      children: [
        {
          path: '',
          name: 'overview',
          component: () => import('./views/Overview.vue'),
          meta: { title: 'Overview' },
          // Arriving (signing in, opening Busbar) lands a person on their own work; the menu's Overview stays the overview.
          beforeEnter: (_to, from) => {
            const arriving = from.matched.length === 0 || from.name === 'sign-in' || from.name === 'set-password' || from.name === 'reset-password';
            const home = homeOf(useSessionStore().assignments);
            return arriving && home !== 'overview' ? { name: home } : true;
          },
        },
        {
          path: 'staff',
          name: 'staff',
          component: () => import('./views/staff/StaffList.vue'),
          meta: { action: 'read', subject: 'RoleAssignment', title: 'Staff' },
        },
        {
          path: 'staff/:id(\\d+)',
          name: 'staff-person',
          component: () => import('./views/staff/StaffDetail.vue'),
          props: (route) => ({ id: Number(route.params.id) }),
          meta: { action: 'read', subject: 'RoleAssignment', title: 'Staff' },
        },
        {
          path: 'builds',
          name: 'builds',
          component: () => import('./views/builds/BuildList.vue'),
          meta: { action: 'read', subject: 'Build', title: 'Builds' },
        },
        {
          path: 'builds/new',
          name: 'builds-new',
          component: () => import('./views/builds/BuildForm.vue'),
          meta: { action: 'create', subject: 'Build', title: 'New build' },
        },
        {
          path: 'builds/import',
          name: 'builds-import',
          component: () => import('./views/builds/ImportBuilds.vue'),
          meta: { action: 'create', subject: 'Build', title: 'Import builds' },
        },
        {
          path: 'builds/:id(\\d+)',
          name: 'builds-detail',
          component: () => import('./views/builds/BuildDetail.vue'),
          props: (route) => ({ id: Number(route.params.id) }),
          meta: { action: 'read', subject: 'Build', title: 'Build' },
        },
        {
          path: 'builds/:id(\\d+)/plan/print',
          name: 'builds-plan-print',
          component: () => import('./views/planner/PlanPrint.vue'),
          props: (route) => ({ buildId: Number(route.params.id) }),
          meta: { action: 'read', subject: 'Build', title: 'Power plan sheet' },
        },
        {
          path: 'plans',
          name: 'plans',
          component: () => import('./views/planner/QuickPlanList.vue'),
          meta: { action: 'create', subject: 'Plan', title: 'Quick plans' },
        },
        {
          path: 'plans/new',
          name: 'plans-new',
          component: () => import('./views/planner/QuickPlanEditor.vue'),
          meta: { action: 'create', subject: 'Plan', title: 'New quick plan' },
        },
        {
          path: 'plans/:id(\\d+)',
          name: 'plans-detail',
          component: () => import('./views/planner/QuickPlanEditor.vue'),
          props: (route) => ({ id: Number(route.params.id) }),
          meta: { action: 'read', subject: 'Plan', title: 'Quick plan' },
        },
        {
          path: 'plans/:id(\\d+)/print',
          name: 'plans-print',
          component: () => import('./views/planner/PlanPrint.vue'),
          props: (route) => ({ planId: Number(route.params.id) }),
          meta: { action: 'read', subject: 'Plan', title: 'Quick plan sheet' },
        },
        {
          path: 'customers',
          name: 'customers',
          component: () => import('./views/customers/CustomerList.vue'),
          meta: { action: 'read', subject: 'Customer', title: 'Customers' },
        },
        {
          path: 'customers/:id(\\d+)',
          name: 'customers-detail',
          component: () => import('./views/customers/CustomerDetail.vue'),
          props: (route) => ({ id: Number(route.params.id) }),
          meta: { action: 'read', subject: 'Customer', title: 'Customer' },
        },
        {
          path: 'catalog',
          name: 'catalog',
          component: () => import('./views/catalog/CatalogList.vue'),
          meta: { action: 'read', subject: 'CatalogItem', title: 'Catalog' },
        },
        {
          path: 'vendors',
          name: 'vendors',
          component: () => import('./views/catalog/VendorList.vue'),
          meta: { action: 'read', subject: 'Vendor', title: 'Vendors' },
        },
        {
          path: 'serials',
          name: 'serials',
          component: () => import('./views/serials/SerialSearch.vue'),
          meta: { action: 'read', subject: 'Build', title: 'Find a serial number' },
        },
        {
          path: 'claims',
          name: 'claims',
          component: () => import('./views/claims/ClaimList.vue'),
          meta: { action: 'read', subject: 'Claim', title: 'Warranty claims' },
        },
        {
          path: 'claims/new',
          name: 'claims-new',
          component: () => import('./views/claims/ClaimForm.vue'),
          meta: { action: 'create', subject: 'Claim', title: 'Log a claim' },
        },
        {
          path: 'claims/:id(\\d+)',
          name: 'claims-detail',
          component: () => import('./views/claims/ClaimDetail.vue'),
          props: (route) => ({ id: Number(route.params.id) }),
          meta: { action: 'read', subject: 'Claim', title: 'Claim' },
        },
        {
          path: 'shop-week',
          name: 'shop-week',
          component: () => import('./views/home/ShopWeek.vue'),
          meta: { action: 'plan', subject: 'Build', title: 'This week' },
        },
        {
          path: 'my-bay',
          name: 'my-bay',
          component: () => import('./views/home/MyBay.vue'),
          meta: { action: 'update', subject: 'Build', title: 'My bay today' },
        },
        {
          path: 'compare',
          name: 'compare',
          component: () => import('./views/network/LocationsCompared.vue'),
          meta: { action: 'read', subject: 'Report', title: 'Locations compared' },
        },
        {
          path: 'month-close',
          name: 'closes',
          component: () => import('./views/money/MonthClose.vue'),
          meta: { action: 'export', subject: 'Report', title: 'Month close' },
        },
        {
          path: 'month-close/status',
          name: 'close-status',
          component: () => import('./views/money/CloseStatus.vue'),
          meta: { action: 'export', subject: 'Report', title: 'Close status' },
        },
        {
          path: 'exports',
          name: 'exports',
          component: () => import('./views/money/Exports.vue'),
          meta: { action: 'export', subject: 'Report', title: 'Exports' },
        },
        {
          path: 'reliability',
          name: 'reliability',
          component: () => import('./views/reliability/ReliabilityList.vue'),
          meta: { action: 'read', subject: 'Reliability', title: 'Component reliability' },
        },
        {
          path: 'reliability/:groupBy(item|category|vendor)/:key',
          name: 'reliability-detail',
          component: () => import('./views/reliability/ReliabilityDetail.vue'),
          props: (route) => ({ groupBy: route.params.groupBy, groupKey: route.params.key }),
          meta: { action: 'read', subject: 'Reliability', title: 'Component reliability' },
        },
        {
          path: 'locations',
          name: 'locations',
          component: () => import('./views/locations/LocationList.vue'),
          meta: { action: 'update', subject: 'Location', title: 'Locations' },
        },
        {
          path: 'outbox',
          name: 'outbox',
          component: () => import('./views/outbox/OutboxList.vue'),
          meta: { action: 'read', subject: 'Mail', title: 'Outbox' },
        },
        {
          path: 'audit',
          name: 'audit',
          component: () => import('./views/audit/AuditList.vue'),
          meta: { action: 'read', subject: 'AuditLog', title: 'Audit log' },
        },
        {
          path: 'account/password',
          name: 'change-password',
          component: () => import('./views/ChangePassword.vue'),
          meta: { title: 'Change password' },
        },
        { path: 'forbidden', name: 'forbidden', component: () => import('./views/Forbidden.vue'), meta: { title: 'No access' } },
      ],
    },
    {
      path: '/:pathMatch(.*)*',
      name: 'not-found',
      component: () => import('./views/NotFound.vue'),
      meta: { public: true, title: 'Page not found' },
    },
  ],
});

/** Only a path inside the app may be a `next` target, never another site. */
export function safeNext(value: unknown): string {
  return typeof value === 'string' && value.startsWith('/') && !value.startsWith('//') ? value : '/';
}

function signInFor(to: RouteLocationNormalized) {
  return { name: 'sign-in', query: to.fullPath === '/' ? {} : { next: to.fullPath } };
}

router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.ensureLoaded();
  if (to.name === 'sign-in' && session.person) return safeNext(to.query.next);
  if (to.meta.public) return true;
  if (!session.person) return signInFor(to);
  const { action, subject } = to.meta;
  if (action && subject && !ability.can(action, subject)) return { name: 'forbidden' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Busbar` : 'Busbar';
});
