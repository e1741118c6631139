import { TabbedSection } from '../../components/TabbedSection';
import { paths } from '../../config/paths';

const ADMIN_PAGES = [
  { name: 'Districts & blocks', path: paths.admin.blocks },
  { name: 'People', path: paths.admin.people },
  { name: 'Crop calendars', path: paths.admin.calendars },
  { name: 'Audit trail', path: paths.admin.audit },
  { name: 'Mail log', path: paths.admin.mail },
] as const;

export default function AdminLayout() {
  return <TabbedSection title="Admin" label="Admin pages" pages={ADMIN_PAGES} />;
}
