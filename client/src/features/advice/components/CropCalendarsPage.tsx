import { Select, SelectItem } from '@carbon/react';
import { useState } from 'react';
import { useDistricts } from '../../../api/districts';
import { LoadError } from '../../../components/LoadError';
import { PageSection } from '../../../components/PageSection';
import { useSessionUser } from '../../../lib/auth';
import { useCropCalendar } from '../api';
import { CalendarEditor } from './CalendarEditor';
import { ImportCalendars } from './ImportCalendars';

/** Crop calendars per district: the scientist and the admin edit them, the writer reads them. */
export default function CropCalendarsPage() {
  const user = useSessionUser();
  const canEdit = user.role === 'scientist' || user.role === 'admin';
  const districts = useDistricts();
  const [chosen, setChosen] = useState<number | null>(null);
  const districtId = chosen ?? districts.data?.[0]?.id ?? null;
  const calendar = useCropCalendar(districtId);

  return (
    <>
      <PageSection title="Crop calendar" region="the crop calendar">
        {districts.isError ? (
          <LoadError what="the districts" error={districts.error} onRetry={() => districts.refetch()} />
        ) : null}
        <div className="toolbar-filter">
          <Select
            id="calendar-district"
            labelText="District"
            value={districtId ?? ''}
            onChange={(event) => setChosen(Number(event.target.value))}
          >
            {(districts.data ?? []).map((d) => (
              <SelectItem key={d.id} value={d.id} text={d.name} />
            ))}
          </Select>
        </div>
        {calendar.isError ? (
          <LoadError what="the crop calendar" error={calendar.error} onRetry={() => calendar.refetch()} />
        ) : null}
        {calendar.data ? (
          <CalendarEditor key={calendar.data.districtId} calendar={calendar.data} canEdit={canEdit} />
        ) : null}
        {districts.data?.length === 0 ? <p>There are no districts yet.</p> : null}
      </PageSection>
      {canEdit ? (
        <PageSection title="Import from CSV" region="the import">
          <ImportCalendars />
        </PageSection>
      ) : null}
    </>
  );
}
