import { paths } from './paths';

export type NavItem = { to: string; label: string };

/** The main navigation; each screen adds its entry here. */
export const navigation: NavItem[] = [{ to: paths.home, label: 'Overview' }];
