import {
  Button,
  InlineNotification,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableHeader,
  TableRow,
  TextInput,
} from '@carbon/react';
import { type CropCalendarView, formatDay, USUAL_STAGES } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { messageOf } from '../../../lib/apiError';
import { useSaveCropCalendar } from '../api';
import { type CalendarRow, checkRows, newRow, rowsFromEntries } from '../calendarRows';
import { StageChart } from './StageChart';

type Field = 'crop' | 'stage' | 'fromWeek' | 'toWeek';
const COLUMNS: { field: Field; header: string }[] = [
  { field: 'crop', header: 'Crop' },
  { field: 'stage', header: 'Stage' },
  { field: 'fromWeek', header: 'From week' },
  { field: 'toWeek', header: 'To week' },
];
const USUAL_CROPS = Object.keys(USUAL_STAGES);
const USUAL_STAGE_NAMES = [...new Set(Object.values(USUAL_STAGES).flat())];

/** One district's calendar as an editable table, saved whole; the chart follows the rows as typed. */
export function CalendarEditor({ calendar, canEdit }: { calendar: CropCalendarView; canEdit: boolean }) {
  const [rows, setRows] = useState<CalendarRow[]>(() => rowsFromEntries(calendar.entries));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  const save = useSaveCropCalendar(calendar.districtId);
  // A save or an import brings a new calendar: start again from it.
  const [shown, setShown] = useState(calendar.updatedAt);
  if (shown !== calendar.updatedAt) {
    setShown(calendar.updatedAt);
    setRows(rowsFromEntries(calendar.entries));
  }
  const dirty =
    JSON.stringify(rows.map(({ key: _k, ...r }) => r)) !==
    JSON.stringify(rowsFromEntries(calendar.entries).map(({ key: _k, ...r }) => r));

  const drawable = useMemo(
    () =>
      rows
        .map((r) => ({
          crop: r.crop.trim().toLowerCase(),
          stage: r.stage.trim().toLowerCase(),
          fromWeek: Number(r.fromWeek),
          toWeek: Number(r.toWeek),
        }))
        .filter(
          (e) =>
            e.crop &&
            e.stage &&
            [e.fromWeek, e.toWeek].every((w) => Number.isInteger(w) && w >= 1 && w <= 53),
        ),
    [rows],
  );

  function edit(key: string, field: Field, value: string) {
    setSaved(false);
    setRows((current) => current.map((r) => (r.key === key ? { ...r, [field]: value } : r)));
  }

  function submit() {
    const check = checkRows(rows);
    if (!check.ok) {
      setErrors(check.errors);
      return;
    }
    setErrors({});
    save.mutate(check.request, {
      onSuccess: () => setSaved(true),
    });
  }

  return (
    <div className="form-stack">
      <datalist id="usual-crops">
        {USUAL_CROPS.map((c) => (
          <option key={c} value={c} />
        ))}
      </datalist>
      <datalist id="usual-stages">
        {USUAL_STAGE_NAMES.map((s) => (
          <option key={s} value={s} />
        ))}
      </datalist>
      <p className="cds--label-description">
        Weeks are ISO 8601 weeks (Monday to Sunday; week 1 holds the year’s first Thursday). A stage whose
        first week comes after its last runs over the new year, e.g. 50 to 4.
      </p>
      <Table aria-label={`Crop calendar of ${calendar.districtName}`} size="sm">
        <TableHead>
          <TableRow>
            {COLUMNS.map((c) => (
              <TableHeader key={c.field}>{c.header}</TableHeader>
            ))}
            {canEdit ? (
              <TableHeader>
                <span className="cds--visually-hidden">Actions</span>
              </TableHeader>
            ) : null}
          </TableRow>
        </TableHead>
        <TableBody>
          {rows.length === 0 ? (
            <TableRow>
              <TableCell colSpan={5}>No stages yet{canEdit ? ': add one or import a CSV.' : '.'}</TableCell>
            </TableRow>
          ) : null}
          {rows.map((row, index) => (
            <TableRow key={row.key}>
              {COLUMNS.map(({ field, header }) => (
                <TableCell key={field}>
                  {canEdit ? (
                    <TextInput
                      id={`${row.key}-${field}`}
                      labelText={`${header}, row ${index + 1}`}
                      hideLabel
                      size="sm"
                      list={field === 'crop' ? 'usual-crops' : field === 'stage' ? 'usual-stages' : undefined}
                      inputMode={field.endsWith('Week') ? 'numeric' : undefined}
                      value={row[field]}
                      invalid={Boolean(errors[`${row.key}.${field}`])}
                      invalidText={errors[`${row.key}.${field}`]}
                      onChange={(event) => edit(row.key, field, event.target.value)}
                    />
                  ) : (
                    row[field]
                  )}
                </TableCell>
              ))}
              {canEdit ? (
                <TableCell className="row-actions">
                  <Button
                    kind="ghost"
                    size="sm"
                    onClick={() => {
                      setSaved(false);
                      setRows((current) => current.filter((r) => r.key !== row.key));
                    }}
                  >
                    Remove<span className="cds--visually-hidden"> row {index + 1}</span>
                  </Button>
                </TableCell>
              ) : null}
            </TableRow>
          ))}
        </TableBody>
      </Table>
      {canEdit ? (
        <div className="button-row">
          <Button kind="tertiary" size="sm" onClick={() => setRows((current) => [...current, newRow()])}>
            Add stage
          </Button>
          <Button size="sm" onClick={submit} disabled={save.isPending || !dirty}>
            Save calendar
          </Button>
          <Button
            kind="ghost"
            size="sm"
            disabled={!dirty}
            onClick={() => {
              setErrors({});
              setRows(rowsFromEntries(calendar.entries));
            }}
          >
            Discard changes
          </Button>
        </div>
      ) : null}
      {Object.keys(errors).length > 0 ? (
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title="The calendar was not saved."
          subtitle="Correct the marked cells."
        />
      ) : null}
      {save.isError ? (
        <InlineNotification
          kind="error"
          lowContrast
          title="The calendar was not saved."
          subtitle={messageOf(save.error)}
        />
      ) : null}
      {saved && !dirty ? (
        <InlineNotification
          kind="success"
          lowContrast
          title={`Saved ${rows.length} stages of ${calendar.districtName}.`}
        />
      ) : null}
      <StageChart entries={drawable} markDay={formatDay(new Date())} />
    </div>
  );
}
