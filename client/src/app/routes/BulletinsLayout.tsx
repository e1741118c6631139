import { TabbedSection } from '../../components/TabbedSection';
import { paths } from '../../config/paths';
import { useSessionUser } from '../../lib/auth';

const BULLETINS = { name: 'Bulletins', path: paths.bulletins.list };
const RULES = { name: 'Advice rules', path: paths.bulletins.rules };
const CALENDARS = { name: 'Crop calendars', path: paths.bulletins.calendars };

/**
 * The bulletins, then what their advice is drawn from. The administrator reviews bulletins but keeps
 * calendars under Admin and has no part in the rules, so sees the bulletins alone.
 */
export default function BulletinsLayout() {
  const user = useSessionUser();
  const pages = user.role === 'admin' ? [BULLETINS] : [BULLETINS, RULES, CALENDARS];
  // Anything under the section that is not a rules or calendars page is a bulletin.
  const tabOf = (pathname: string) =>
    Math.max(
      0,
      pages.findIndex((p) => p !== BULLETINS && pathname.startsWith(p.path)),
    );
  return <TabbedSection title="Bulletins" label="Bulletins pages" pages={pages} tabOf={tabOf} />;
}
