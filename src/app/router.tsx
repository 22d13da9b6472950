import { Navigate, type RouteObject } from 'react-router-dom';
import { Spinner } from '../components/ui/spinner';
import { RouteError } from './route-error';
import { NotFoundRoute } from './routes/not-found';

/**
 * The route table. Each page is its own chunk, loaded the first time someone goes there.
 * NOTE: a function, not a constant: React Router caches resolved `lazy` results on the route
 * objects, so a second router (each test builds one) must get fresh objects.
 */
export function createRoutes(): RouteObject[] {
  return [
    {
      HydrateFallback: () => <Spinner />,
      ErrorBoundary: RouteError,
      children: [
        { path: '/sign-in', lazy: { Component: async () => (await import('./routes/sign-in')).SignInRoute } },
        { path: '/sign-up', lazy: { Component: async () => (await import('./routes/sign-up')).SignUpRoute } },
        { path: '/welcome', lazy: { Component: async () => (await import('./routes/welcome')).WelcomeRoute } },
        { path: '/forgot', lazy: { Component: async () => (await import('./routes/forgot')).ForgotRoute } },
        { path: '/reset', lazy: { Component: async () => (await import('./routes/reset')).ResetRoute } },
        { path: '/admin/mails', lazy: { Component: async () => (await import('./routes/admin-mails')).AdminMailsRoute } },
        { path: '/shared/:token', lazy: { Component: async () => (await import('./routes/shared')).SharedRoute } },
        {
          lazy: { Component: async () => (await import('./routes/app-layout')).AppLayout },
          children: [
            { index: true, element: <Navigate to="/drafts" replace /> },
            { path: '/drafts', lazy: { Component: async () => (await import('./routes/drafts')).DraftsRoute } },
            { path: '/bin', lazy: { Component: async () => (await import('./routes/bin')).BinRoute } },
            { path: '/drafts/new', lazy: { Component: async () => (await import('./routes/new-draft')).NewDraftRoute } },
            {
              // The draft workspace: one header, and each part of the draft a section with its own address.
              path: '/drafts/:id',
              handle: { wide: true },
              lazy: { Component: async () => (await import('./routes/draft')).DraftRoute },
              children: [
                { index: true, lazy: { Component: async () => (await import('./routes/draft-design')).DesignSection } },
                { path: 'plan', lazy: { Component: async () => (await import('./routes/plan')).PlanRoute } },
                { path: 'loom', lazy: { Component: async () => (await import('./routes/loom')).LoomRoute } },
                { path: 'history', lazy: { Component: async () => (await import('./routes/history')).HistoryRoute } },
                { path: 'print', lazy: { Component: async () => (await import('./routes/draft-print')).PrintSection } },
                { path: 'notes', lazy: { Component: async () => (await import('./routes/draft-notes')).NotesSection } },
                { path: 'discussion', lazy: { Component: async () => (await import('./routes/draft-discussion')).DiscussionSection } },
              ],
            },
            { path: '/yarns', lazy: { Component: async () => (await import('./routes/yarns')).YarnsRoute } },
            { path: '/join', lazy: { Component: async () => (await import('./routes/join')).JoinRoute } },
            { path: '/studios', lazy: { Component: async () => (await import('./routes/studios')).StudiosRoute } },
            { path: '/studios/:id', lazy: { Component: async () => (await import('./routes/studio')).StudioRoute } },
            { path: '/account', lazy: { Component: async () => (await import('./routes/account')).AccountRoute } },
          ],
        },
        // Static: the error boundary needs this page in the main chunk anyway.
        { path: '*', Component: NotFoundRoute },
      ],
    },
  ];
}
