import type { Role } from '@shared/contracts/auth';

export interface NavItem {
  path: string;
  label: string;
  icon: string;
  /** Roles that see the item; all when absent. */
  roles?: Role[];
}

// One entry per feature that exists; a feature adds its line here when it lands.
export const navItems: NavItem[] = [
  { path: '', label: 'Home', icon: 'home' },
  { path: 'calendar', label: 'Calendar', icon: 'calendar_month' },
  { path: 'markets', label: 'Markets', icon: 'storefront' },
  { path: 'trends', label: 'Trends', icon: 'trending_up' },
  { path: 'themes', label: 'Themes', icon: 'category' },
  { path: 'templates', label: 'Runway templates', icon: 'view_timeline' },
  { path: 'imports', label: 'Imports', icon: 'upload_file' },
  { path: 'team', label: 'Team', icon: 'group' },
  { path: 'feeds', label: 'Feeds', icon: 'rss_feed' },
  { path: 'settings', label: 'Studio settings', icon: 'tune', roles: ['owner'] },
  { path: 'mailbox', label: 'Mailbox', icon: 'mail' },
  { path: 'profile', label: 'Profile', icon: 'person' },
];
