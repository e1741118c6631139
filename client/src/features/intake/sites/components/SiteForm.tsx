import { Button, InlineNotification } from '@carbon/react';
import type { SiteView } from '@stormhour/shared';
import { type FormEvent, useState } from 'react';
import { Link as RouterLink, useNavigate } from 'react-router';
import { paths } from '../../../../config/paths';
import { ApiError, messageOf } from '../../../../lib/apiError';
import { useCreateSite, useUpdateSite } from '../api';
import { FIXED_AFTER_CREATE, SETTINGS_SECTIONS, SITE_FIELDS } from '../siteFields';
import {
  checkCreate,
  checkUpdate,
  type FieldErrors,
  placedKeys,
  placeErrors,
  type SiteFormValues,
  siteFormValues,
} from '../siteForm';
import { BlockedSectorsField } from './BlockedSectorsField';
import { SiteFieldInput } from './SiteFieldInput';

const DEFAULTS = siteFormValues().fields;
const FIXED = new Set<string>(FIXED_AFTER_CREATE);

/** Adds a site (without `site`) or edits one; errors from the schema and the server sit on their fields. */
export function SiteForm({ site }: { site?: SiteView }) {
  const navigate = useNavigate();
  const [values, setValues] = useState<SiteFormValues>(() => siteFormValues(site));
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateSite();
  const update = useUpdateSite();
  const mutation = site ? update : create;

  const setField = (key: string, value: string) =>
    setValues((v) => ({ ...v, fields: { ...v.fields, [key]: value } }));

  async function submit(event: FormEvent) {
    event.preventDefault();
    try {
      if (site) {
        const checked = checkUpdate(site, values);
        if (!checked.ok) return setErrors(checked.errors);
        setErrors({});
        if (Object.keys(checked.body).length > 0)
          await update.mutateAsync({ id: site.id, body: checked.body });
      } else {
        const checked = checkCreate(values);
        if (!checked.ok) return setErrors(checked.errors);
        setErrors({});
        await create.mutateAsync(checked.body);
      }
      navigate(paths.intake.sites);
    } catch (error) {
      if (error instanceof ApiError) setErrors(placeErrors(error.fieldErrors));
    }
  }

  const placed = placedKeys(values.sectors.length);
  const unplaced = Object.entries(errors).filter(([key]) => !placed.has(key));
  const problemCount = Object.keys(errors).length;

  return (
    <form
      className="site-form"
      onSubmit={submit}
      noValidate
      aria-label={site ? `Edit ${site.code}` : 'Add site'}
    >
      {mutation.isError ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The site was not saved."
          subtitle={messageOf(mutation.error)}
        />
      ) : problemCount > 0 ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="Check the form."
          subtitle={`${problemCount} ${problemCount === 1 ? 'field needs' : 'fields need'} a change; each is marked below.`}
        />
      ) : null}
      {unplaced.length > 0 ? (
        <ul className="field-problems" aria-label="Other problems">
          {unplaced.map(([key, problem]) => (
            <li key={key}>
              <span className="mono">{key}</span>: {problem}
            </li>
          ))}
        </ul>
      ) : null}

      <fieldset className="site-form__section">
        <legend className="section-title">Site</legend>
        <div className="site-form__grid">
          {SITE_FIELDS.map((field) => (
            <SiteFieldInput
              key={field.key}
              field={field}
              value={values.fields[field.key]}
              error={errors[field.key]}
              readOnly={Boolean(site) && FIXED.has(field.key)}
              onChange={(value) => setField(field.key, value)}
            />
          ))}
        </div>
      </fieldset>

      <BlockedSectorsField
        sectors={values.sectors}
        errors={errors}
        onChange={(sectors) => setValues((v) => ({ ...v, sectors }))}
      />

      {site ? (
        <InlineNotification
          kind="info"
          lowContrast
          hideCloseButton
          title={`Settings version ${site.settingsVersion}.`}
          subtitle={`Changing settings creates version ${site.settingsVersion + 1}; cells already found keep the version that made them.`}
        />
      ) : null}
      {SETTINGS_SECTIONS.map((section) => (
        <fieldset key={section.title} className="site-form__section">
          <legend className="section-title">{section.title}</legend>
          <div className="site-form__grid">
            {section.fields.map((field) => (
              <SiteFieldInput
                key={field.key}
                field={field}
                value={values.fields[field.key]}
                defaultValue={DEFAULTS[field.key]}
                error={errors[field.key]}
                onChange={(value) => setField(field.key, value)}
              />
            ))}
          </div>
        </fieldset>
      ))}

      <div className="form-actions">
        <Button type="submit" disabled={mutation.isPending}>
          {site ? 'Save changes' : 'Create site'}
        </Button>
        <Button kind="secondary" as={RouterLink} to={paths.intake.sites}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
