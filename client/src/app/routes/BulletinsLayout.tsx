import { TabbedSection } from '../../components/TabbedSection';
import { paths } from '../../config/paths';

// Drafting, review and sending of bulletins come as further tabs.
const BULLETINS_PAGES = [
  { name: 'Advice rules', path: paths.bulletins.rules },
  { name: 'Crop calendars', path: paths.bulletins.calendars },
] as const;

export default function BulletinsLayout() {
  return <TabbedSection title="Bulletins" label="Bulletins pages" pages={BULLETINS_PAGES} />;
}
