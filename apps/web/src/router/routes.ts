import { WEB_PATHS } from '@ebullio/schemas/web-paths'
import type { RouteRecordRaw } from 'vue-router'

/** Every page of the app; paths come from WEB_PATHS (@ebullio/schemas), which the API's mail links use too. */
export const appRoutes: RouteRecordRaw[] = [
  { path: WEB_PATHS.home, name: 'home', component: () => import('../views/HomeView.vue'), meta: { title: 'Overview' } },
  {
    path: WEB_PATHS.datasets,
    name: 'datasets',
    component: () => import('../views/datasets/DatasetsListView.vue'),
    meta: {
      title: 'Data sets',
      roles: ['analyst', 'lead_chemist', 'reviewer'],
      nav: {
        group: 'Laboratory',
        label: 'Data sets',
        icon: 'pi pi-table',
        order: 10,
        hint: 'Measured T–x–y and P–x–y data sets: upload GC files, fit models, submit for approval.',
      },
    },
  },
  {
    path: WEB_PATHS.datasetNew,
    name: 'dataset-new',
    component: () => import('../views/datasets/NewDatasetView.vue'),
    meta: { title: 'New data set', roles: ['analyst', 'lead_chemist'] },
  },
  {
    path: WEB_PATHS.dataset,
    name: 'dataset',
    component: () => import('../views/datasets/DatasetWorkspaceView.vue'),
    meta: { title: 'Data set', roles: ['analyst', 'lead_chemist', 'reviewer'] },
  },
  {
    path: WEB_PATHS.labSystem,
    name: 'lab-system',
    component: () => import('../views/systems/LabSystemView.vue'),
    meta: { title: 'System', roles: ['analyst', 'lead_chemist', 'reviewer', 'admin'] },
  },
  {
    path: WEB_PATHS.instrumentChecks,
    name: 'checks',
    component: () => import('../views/checks/InstrumentChecksView.vue'),
    meta: {
      title: 'Instrument checks',
      roles: ['analyst', 'lead_chemist', 'reviewer', 'admin'],
      nav: {
        group: 'Laboratory',
        label: 'Instrument checks',
        icon: 'pi pi-stopwatch',
        order: 13,
        hint: 'Thermometer and barometer checks against a boiling reference liquid, with their history.',
      },
    },
  },
  {
    path: WEB_PATHS.approvals,
    name: 'approvals',
    component: () => import('../views/approvals/ApprovalsQueueView.vue'),
    meta: {
      title: 'Awaiting signature',
      roles: ['lead_chemist'],
      nav: {
        group: 'Review',
        label: 'Awaiting signature',
        icon: 'pi pi-verified',
        order: 20,
        hint: 'Data sets submitted for your review and electronic signature.',
      },
    },
  },
  {
    path: WEB_PATHS.threads,
    name: 'threads',
    component: () => import('../views/threads/MyThreadsView.vue'),
    meta: {
      title: 'My open threads',
      roles: ['reviewer', 'lead_chemist', 'analyst'],
      nav: {
        group: 'Review',
        label: 'My open threads',
        icon: 'pi pi-comments',
        order: 21,
        hint: 'Comment threads you started or were asked about, still unresolved.',
      },
    },
  },
  {
    path: WEB_PATHS.catalogue,
    name: 'catalogue',
    component: () => import('../views/catalogue/CatalogueView.vue'),
    meta: {
      title: 'Approved systems',
      roles: ['engineer'],
      nav: {
        group: 'Design',
        label: 'Approved systems',
        icon: 'pi pi-book',
        order: 30,
        hint: 'Signed-off binary systems: curves at your pressure, stages, batch stills.',
      },
    },
  },
  {
    path: WEB_PATHS.system,
    name: 'system',
    component: () => import('../views/catalogue/SystemView.vue'),
    meta: { title: 'Approved system', roles: ['engineer'] },
  },
  {
    path: WEB_PATHS.adminPeople,
    name: 'admin-users',
    component: () => import('../views/admin/AdminUsersView.vue'),
    meta: {
      title: 'People and roles',
      roles: ['admin'],
      nav: {
        group: 'Administration',
        label: 'People and roles',
        icon: 'pi pi-users',
        order: 40,
        hint: 'Invite colleagues, assign roles, deactivate accounts.',
      },
    },
  },
  {
    path: WEB_PATHS.adminComponents,
    name: 'admin-components',
    component: () => import('../views/admin/AdminComponentsView.vue'),
    meta: {
      title: 'Components',
      // the lab records boiling points and creates systems here; only admins and lead chemists edit components
      roles: ['admin', 'lead_chemist', 'analyst', 'reviewer'],
      nav: {
        group: 'Laboratory',
        label: 'Components and systems',
        icon: 'pi pi-box',
        order: 12,
        hint: 'Pure components with vapour-pressure constants, critical data and sources; the binary systems built from them.',
      },
    },
  },
  {
    path: WEB_PATHS.adminGcMethods,
    name: 'admin-gc',
    component: () => import('../views/admin/AdminGcMethodsView.vue'),
    meta: {
      title: 'GC methods',
      roles: ['admin'],
      nav: {
        group: 'Administration',
        label: 'GC methods',
        icon: 'pi pi-sliders-h',
        order: 42,
        hint: 'Chromatography methods and their response-factor calibrations.',
      },
    },
  },
  {
    path: WEB_PATHS.adminMail,
    name: 'admin-mail',
    component: () => import('../views/admin/MailCaptureView.vue'),
    meta: {
      title: 'Captured mail',
      roles: ['admin'],
      nav: {
        group: 'Administration',
        label: 'Captured mail',
        icon: 'pi pi-envelope',
        order: 43,
        hint: 'Mail the app sent, caught by the local mail capture (development only).',
        devOnly: true,
      },
    },
  },
  {
    path: WEB_PATHS.adminOutbox,
    name: 'admin-outbox',
    component: () => import('../views/admin/UndeliveredMailView.vue'),
    meta: {
      title: 'Undelivered mail',
      roles: ['admin'],
      nav: {
        group: 'Administration',
        label: 'Undelivered mail',
        icon: 'pi pi-exclamation-circle',
        order: 44,
        hint: 'Messages the mail server refused or that are still being retried.',
      },
    },
  },
  {
    path: WEB_PATHS.account,
    name: 'account',
    component: () => import('../views/AccountView.vue'),
    meta: {
      title: 'Your account',
      nav: {
        group: 'You',
        label: 'Your account',
        icon: 'pi pi-user',
        order: 90,
        hint: 'Your password and whether the app sends you e-mail.',
      },
    },
  },
  {
    path: WEB_PATHS.verifyReport,
    name: 'verify-report',
    component: () => import('../views/reports/VerifyReportView.vue'),
    meta: { title: 'Verify a printed report' },
  },
  {
    path: WEB_PATHS.forbidden,
    name: 'forbidden',
    component: () => import('../views/ForbiddenView.vue'),
    meta: { title: 'Not allowed' },
  },
]

export const routes: RouteRecordRaw[] = [
  {
    path: WEB_PATHS.signIn,
    name: 'sign-in',
    component: () => import('../views/auth/SignInView.vue'),
    meta: { public: true, title: 'Sign in' },
  },
  {
    path: WEB_PATHS.forgotPassword,
    name: 'forgot',
    component: () => import('../views/auth/ForgotPasswordView.vue'),
    meta: { public: true, title: 'Forgotten password' },
  },
  {
    path: WEB_PATHS.resetPassword,
    name: 'reset',
    component: () => import('../views/auth/ResetPasswordView.vue'),
    meta: { public: true, title: 'New password' },
  },
  {
    path: WEB_PATHS.welcome,
    name: 'welcome',
    component: () => import('../views/auth/AcceptInviteView.vue'),
    meta: { public: true, title: 'Welcome' },
  },
  // lazily loaded, so the sign-in page carries neither the frame's navigation nor what it imports
  { path: '/', component: () => import('../components/base/AppFrame.vue'), children: appRoutes },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('../views/NotFoundView.vue'),
    meta: { public: true, title: 'Page not found' },
  },
]
