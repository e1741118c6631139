import { RegionBoundary } from '../../../../components/RegionBoundary';
import { PeopleTable } from './PeopleTable';

export default function PeoplePage() {
  return (
    <RegionBoundary region="the people table">
      <PeopleTable />
    </RegionBoundary>
  );
}
