import type { RouteRecordRaw } from 'vue-router';
import type { Access } from '@shared/access/capabilities';

declare module 'vue-router' {
  interface RouteMeta {
    /** What entering needs (a capability from shared/access/capabilities.ts, or just a session); absent on public pages. */
    access?: Access;
    /** Shown in the left navigation (to the roles the access allows) when set. */
    nav?: { label: string; icon: string; caption?: string };
    /** Pages for signed-out visitors only. */
    guestOnly?: boolean;
    title?: string;
  }
}

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    component: () => import('src/layouts/MainLayout.vue'),
    children: [
      {
        path: '',
        name: 'overview',
        component: () => import('src/pages/OverviewPage.vue'),
        meta: { access: 'signedIn', nav: { label: 'Overview', icon: 'dashboard' }, title: 'Overview' },
      },
      {
        path: 'catchments',
        name: 'catchments',
        component: () => import('src/pages/CatchmentsPage.vue'),
        meta: { access: 'readCatchments', nav: { label: 'Catchments', icon: 'terrain', caption: 'Bands, climate, scenarios' }, title: 'Catchments' },
      },
      {
        path: 'catchments/:id(\\d+)',
        name: 'catchment',
        component: () => import('src/pages/CatchmentDetailPage.vue'),
        meta: { access: 'readCatchments', title: 'Catchment' },
      },
      {
        path: 'catchments/:id(\\d+)/scenarios/:scenarioId(\\d+|new)',
        name: 'scenario',
        component: () => import('src/pages/ScenarioBuilderPage.vue'),
        meta: { access: 'readCatchments', title: 'Scenario' },
      },
      {
        path: 'catchments/:id(\\d+)/results',
        name: 'run-results',
        component: () => import('src/pages/RunResultsPage.vue'),
        meta: { access: 'runScenarios', title: 'Results' },
      },
      {
        path: 'catchments/:id(\\d+)/runs/:runId(\\d+)/years',
        name: 'transient-results',
        component: () => import('src/pages/TransientResultsPage.vue'),
        meta: { access: 'runScenarios', title: 'Multi-decade results' },
      },
      {
        path: 'lab',
        name: 'lab',
        component: () => import('src/pages/LabPage.vue'),
        meta: { access: 'useLab', nav: { label: 'Lab', icon: 'science', caption: 'Surface response, calibration' }, title: 'Lab' },
      },
      {
        path: 'studies',
        name: 'studies',
        component: () => import('src/pages/StudiesPage.vue'),
        meta: { access: 'runScenarios', nav: { label: 'Regional studies', icon: 'hub', caption: 'Many catchments, one result' }, title: 'Regional studies' },
      },
      {
        path: 'studies/:id(\\d+)',
        name: 'study',
        component: () => import('src/pages/StudyPage.vue'),
        meta: { access: 'runScenarios', title: 'Regional study' },
      },
      {
        path: 'briefings',
        name: 'briefings',
        component: () => import('src/pages/BriefingsPage.vue'),
        meta: { access: 'readBriefings', nav: { label: 'Briefings', icon: 'article', caption: 'Published results' }, title: 'Briefings' },
      },
      {
        path: 'briefings/:id(\\d+)/edit',
        name: 'briefing-edit',
        component: () => import('src/pages/BriefingEditorPage.vue'),
        meta: { access: 'writeBriefings', title: 'Briefing draft' },
      },
      {
        path: 'briefings/:id(\\d+)/:version(\\d+)?',
        name: 'briefing-read',
        component: () => import('src/pages/BriefingReadingPage.vue'),
        meta: { access: 'readBriefings', title: 'Briefing' },
      },
      {
        path: 'queue',
        name: 'queue',
        component: () => import('src/pages/QueuePage.vue'),
        meta: { access: 'watchQueue', nav: { label: 'Job queue', icon: 'dns', caption: 'Waiting, running, failed' }, title: 'Job queue' },
      },
      {
        path: 'team',
        name: 'team',
        component: () => import('src/pages/TeamPage.vue'),
        meta: { access: 'manageMembers', nav: { label: 'Team', icon: 'group', caption: 'Members and invitations' }, title: 'Team' },
      },
      {
        path: 'account',
        name: 'account',
        component: () => import('src/pages/AccountPage.vue'),
        meta: { access: 'signedIn', title: 'Your account' },
      },
      {
        path: 'billing',
        name: 'billing',
        component: () => import('src/pages/BillingPage.vue'),
        meta: { access: 'manageSeats', nav: { label: 'Seats & billing', icon: 'credit_card' }, title: 'Seats & billing' },
      },
    ],
  },
  {
    path: '/',
    component: () => import('src/layouts/SignInLayout.vue'),
    children: [
      { path: 'sign-in', name: 'sign-in', component: () => import('src/pages/SignInPage.vue'), meta: { guestOnly: true, title: 'Sign in' } },
      { path: 'sign-up', name: 'sign-up', component: () => import('src/pages/SignUpPage.vue'), meta: { guestOnly: true, title: 'Create an account' } },
      { path: 'forgot-password', name: 'forgot-password', component: () => import('src/pages/ForgotPasswordPage.vue'), meta: { guestOnly: true, title: 'Forgot password' } },
      // Opened from mailed links; the token in the query is the credential, so no session is needed.
      { path: 'reset-password', name: 'reset-password', component: () => import('src/pages/ResetPasswordPage.vue'), meta: { title: 'New password' } },
      { path: 'confirm-sign-up', name: 'confirm-sign-up', component: () => import('src/pages/ConfirmSignUpPage.vue'), meta: { title: 'Finishing your account' } },
      { path: 'invitation', name: 'invitation', component: () => import('src/pages/AcceptInvitationPage.vue'), meta: { title: 'Join your team' } },
    ],
  },
  // Development only: the server answers 404 to its data in production.
  { path: '/dev/inbox', name: 'dev-inbox', component: () => import('src/pages/DevInboxPage.vue'), meta: { title: 'Development inbox' } },
  // Always last.
  { path: '/:catchAll(.*)*', name: 'not-found', component: () => import('src/pages/NotFoundPage.vue'), meta: { title: 'Not found' } },
];
