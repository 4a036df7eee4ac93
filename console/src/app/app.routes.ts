import { Routes } from '@angular/router';
import { requireCapability, requireSession, redirectWhenSignedIn } from './auth/guards';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Isochron',
    canActivate: [redirectWhenSignedIn],
    loadComponent: () => import('./auth/sign-in-page/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'accept-invitation',
    title: 'Set your password · Isochron',
    loadComponent: () =>
      import('./auth/accept-invitation-page/accept-invitation-page').then((m) => m.AcceptInvitationPage),
  },
  {
    path: '',
    canActivate: [requireSession],
    loadComponent: () => import('./shell/shell').then((m) => m.Shell),
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Overview · Isochron',
        loadComponent: () => import('./overview/overview-page/overview-page').then((m) => m.OverviewPage),
      },
      {
        path: 'keys',
        title: 'Keys · Isochron',
        canActivate: [requireCapability('keys:view')],
        loadComponent: () => import('./keys/keys-page/keys-page').then((m) => m.KeysPage),
      },
      {
        path: 'usage',
        title: 'Usage · Isochron',
        loadComponent: () => import('./usage/usage-page/usage-page').then((m) => m.UsagePage),
      },
      {
        path: 'rooms',
        title: 'Rooms · Isochron',
        canActivate: [requireCapability('rooms:view')],
        loadComponent: () => import('./rooms/rooms-page/rooms-page').then((m) => m.RoomsPage),
      },
      {
        path: 'rooms/new',
        title: 'New room · Isochron',
        canActivate: [requireCapability('rooms:view')],
        loadComponent: () => import('./rooms/room-editor/room-editor-page').then((m) => m.RoomEditorPage),
      },
      {
        path: 'rooms/:roomId/edit',
        title: 'Edit room · Isochron',
        canActivate: [requireCapability('rooms:view')],
        loadComponent: () => import('./rooms/room-editor/room-editor-page').then((m) => m.RoomEditorPage),
      },
      {
        path: 'rooms/:roomId',
        title: 'Room · Isochron',
        canActivate: [requireCapability('rooms:view')],
        loadComponent: () => import('./rooms/room-page/room-page').then((m) => m.RoomPage),
      },
      {
        path: 'rooms/:roomId/capture',
        title: 'Measure from the browser · Isochron',
        canActivate: [requireCapability('rooms:view')],
        loadComponent: () => import('./capture/capture-page/capture-page').then((m) => m.CapturePage),
      },
      {
        path: 'rooms/:roomId/tunings/:tuningId',
        title: 'Tuning · Isochron',
        canActivate: [requireCapability('rooms:view')],
        loadComponent: () => import('./tunings/tuning-page/tuning-page').then((m) => m.TuningPage),
      },
      {
        path: 'users',
        title: 'Users · Isochron',
        canActivate: [requireCapability('users:manage')],
        loadComponent: () => import('./users/users-page/users-page').then((m) => m.UsersPage),
      },
      {
        path: 'playground',
        title: 'Playground · Isochron',
        loadComponent: () =>
          import('./playground/playground-page/playground-page').then((m) => m.PlaygroundPage),
      },
      {
        // Not `docs`: the API process serves its reference at /docs itself.
        path: 'reference',
        title: 'API reference · Isochron',
        loadComponent: () => import('./docs/docs-page/docs-page').then((m) => m.DocsPage),
      },
      {
        path: 'needs-permission',
        title: 'Needs another role · Isochron',
        loadComponent: () =>
          import('./shell/needs-permission-page/needs-permission-page').then((m) => m.NeedsPermissionPage),
      },
      {
        path: '**',
        title: 'Not found · Isochron',
        loadComponent: () => import('./shell/not-found-page/not-found-page').then((m) => m.NotFoundPage),
      },
    ],
  },
];
