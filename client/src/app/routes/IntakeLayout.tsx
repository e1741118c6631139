import { TabbedSection } from '../../components/TabbedSection';
import { paths } from '../../config/paths';

const INTAKE_PAGES = [
  { name: 'Uploads & jobs', path: paths.intake.uploads },
  { name: 'Radar sites', path: paths.intake.sites },
  { name: 'Tracks', path: paths.intake.tracks },
] as const;

/** Which tab a path belongs to; uploads also own the job pages under /intake/jobs. */
function tabIndexOf(pathname: string): number {
  if (pathname.startsWith(paths.intake.sites)) return 1;
  if (pathname.startsWith(paths.intake.tracks)) return 2;
  return 0;
}

export default function IntakeLayout() {
  return <TabbedSection title="Intake" label="Intake pages" pages={INTAKE_PAGES} tabOf={tabIndexOf} />;
}
