import { Select, SelectItem, TextInput } from '@carbon/react';
import { CreateBulletinRequest } from '@stormhour/shared';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { useDistricts } from '../../../api/districts';
import { FormModal, useSaveAndClose } from '../../../components/FormModal';
import { paths } from '../../../config/paths';
import { useCreateBulletin } from '../api';
import { localToday, nextWeekStart, weekLabel, weekStartOf } from '../bulletinWords';

/** District and week of a new draft; the server fills the rest from the outlook and the rules. */
export function NewBulletinModal({ onClose }: { onClose: () => void }) {
  const districts = useDistricts();
  const [districtId, setDistrictId] = useState('');
  const [day, setDay] = useState(() => nextWeekStart(localToday()));
  const mutation = useCreateBulletin();
  const navigate = useNavigate();
  const { errors, saveChecked } = useSaveAndClose(() => {});
  const weekStart = weekStartOf(day);

  async function submit() {
    await saveChecked(
      CreateBulletinRequest,
      { districtId: Number(districtId) || 0, weekStart: weekStart ?? day },
      async (body) => {
        const created = await mutation.mutateAsync(body);
        navigate(paths.bulletins.bulletin(created.id));
      },
    );
  }

  return (
    <FormModal
      heading="New bulletin"
      primaryButtonText={mutation.isPending ? 'Drafting…' : 'Draft bulletin'}
      mutation={mutation}
      errorTitle="The draft was not made."
      onSubmit={submit}
      onClose={onClose}
    >
      <p className="cds--label-description">
        The draft is filled from the week’s block outlook and the advice rules for the district’s crops; you
        then edit every part before sending it for review.
      </p>
      <Select
        id="new-bulletin-district"
        labelText="District"
        value={districtId}
        onChange={(e) => setDistrictId(e.target.value)}
        invalid={Boolean(errors.districtId)}
        invalidText={errors.districtId}
        data-modal-primary-focus
      >
        <SelectItem value="" text={districts.isLoading ? 'Loading…' : 'Pick a district'} />
        {(districts.data ?? []).map((d) => (
          <SelectItem key={d.id} value={String(d.id)} text={`${d.name} (${d.code})`} />
        ))}
      </Select>
      <TextInput
        id="new-bulletin-week"
        type="date"
        labelText="Week (any day of it)"
        value={day}
        onChange={(e) => setDay(e.target.value)}
        helperText={
          weekStart ? weekLabel(weekStart) : 'Pick a day; the bulletin covers its Monday-to-Sunday week.'
        }
        invalid={Boolean(errors.weekStart)}
        invalidText={errors.weekStart}
      />
    </FormModal>
  );
}
