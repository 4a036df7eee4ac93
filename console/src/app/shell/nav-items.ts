import { Capability } from '../auth/roles';

/** One entry of the side navigation. */
export interface NavItem {
  path: string;
  label: string;
  icon: string;
  /** Shown only to roles with this capability; absent means everyone signed in. */
  needs?: Capability;
  exact?: boolean;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { path: '/', label: 'Overview', icon: 'space_dashboard', exact: true },
  { path: '/keys', label: 'Keys', icon: 'key', needs: 'keys:view' },
  { path: '/usage', label: 'Usage', icon: 'monitoring' },
  { path: '/playground', label: 'Playground', icon: 'science' },
  { path: '/rooms', label: 'Rooms', icon: 'speaker_group', needs: 'rooms:view' },
  { path: '/users', label: 'Users', icon: 'group', needs: 'users:manage' },
  { path: '/reference', label: 'API reference', icon: 'menu_book' },
];
