import type { NavItem } from '../../config/navigation';
import type { Session } from '../../../shared/account';

/**
 * The navigation entries this session may use: entries without `roles` are for everyone; with
 * `roles`, only for a signed-in user of one of them; `devOnly` entries only when the server says
 * the development tools exist for this user.
 */
export function visibleNavigation(items: readonly NavItem[], session: Session): NavItem[] {
  return items.filter((item) => {
    if (item.devOnly && !session.outbox) return false;
    if (!item.roles) return true;
    return session.user !== null && item.roles.includes(session.user.role);
  });
}
