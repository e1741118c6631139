import { TabbedSection } from '../../components/TabbedSection';
import { paths } from '../../config/paths';

const BULLETINS_PAGES = [
  { name: 'Bulletins', path: paths.bulletins.list },
  { name: 'Advice rules', path: paths.bulletins.rules },
  { name: 'Crop calendars', path: paths.bulletins.calendars },
] as const;

/** The rules and calendars tabs by their path; anything else under the section is a bulletin. */
function tabOf(pathname: string): number {
  if (pathname.startsWith(paths.bulletins.rules)) return 1;
  if (pathname.startsWith(paths.bulletins.calendars)) return 2;
  return 0;
}

export default function BulletinsLayout() {
  return <TabbedSection title="Bulletins" label="Bulletins pages" pages={BULLETINS_PAGES} tabOf={tabOf} />;
}
