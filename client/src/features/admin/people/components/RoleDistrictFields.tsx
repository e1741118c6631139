import { Select, SelectItem } from '@carbon/react';
import { type DistrictView, ROLE_LABELS, ROLES } from '@stormhour/shared';

interface RoleDistrictFieldsProps {
  idPrefix: string;
  role: string;
  districtId: string;
  districts: DistrictView[];
  errors: Record<string, string>;
  onRoleChange: (role: string) => void;
  onDistrictChange: (districtId: string) => void;
}

/** Role, and the district that only an extension officer has. */
export function RoleDistrictFields(props: RoleDistrictFieldsProps) {
  return (
    <>
      <Select
        id={`${props.idPrefix}-role`}
        labelText="Role"
        value={props.role}
        onChange={(e) => props.onRoleChange(e.target.value)}
        invalid={Boolean(props.errors.role)}
        invalidText={props.errors.role}
      >
        <SelectItem value="" text="Choose a role" />
        {ROLES.map((role) => (
          <SelectItem key={role} value={role} text={ROLE_LABELS[role]} />
        ))}
      </Select>
      {props.role === 'officer' ? (
        <Select
          id={`${props.idPrefix}-district`}
          labelText="District"
          helperText="An extension officer receives the bulletins of one district."
          value={props.districtId}
          onChange={(e) => props.onDistrictChange(e.target.value)}
          invalid={Boolean(props.errors.districtId)}
          invalidText={props.errors.districtId}
        >
          <SelectItem value="" text="Choose a district" />
          {props.districts.map((d) => (
            <SelectItem key={d.id} value={String(d.id)} text={d.name} />
          ))}
        </Select>
      ) : null}
    </>
  );
}
