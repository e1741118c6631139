import type { RegimeDay, RegimeSettings } from '@stormhour/shared';
import { type CSSProperties, type KeyboardEvent, useId, useMemo, useRef, useState } from 'react';
import { calendarLayout, colourOf, dayDetails, formatDay, type RegimeStyle } from '../regimeFormat';

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];

/** Arrow keys move a day up or down and a week left or right, as the squares are laid out. */
const STEP: Record<string, number> = { ArrowUp: -1, ArrowDown: 1, ArrowLeft: -7, ArrowRight: 7 };

interface SeasonCalendarProps {
  days: RegimeDay[];
  settings: RegimeSettings;
  styles: RegimeStyle[];
}

/**
 * One square per day, weeks as columns and Monday to Sunday as rows, coloured by regime. The period
 * is one Tab stop; arrow keys move between days, and the day in focus or under the pointer is read out.
 */
export function SeasonCalendar({ days, settings, styles }: SeasonCalendarProps) {
  const layout = useMemo(() => calendarLayout(days), [days]);
  const [focusIndex, setFocusIndex] = useState(0);
  const [shownIndex, setShownIndex] = useState<number | null>(null);
  const helpId = useId();
  const buttons = useRef<(HTMLButtonElement | null)[]>([]);
  const stop = Math.min(focusIndex, layout.cells.length - 1);
  const shown = shownIndex === null ? null : (layout.cells[shownIndex]?.day ?? null);

  function move(event: KeyboardEvent, from: number) {
    let next: number | null = null;
    if (event.key in STEP) next = from + STEP[event.key];
    else if (event.key === 'Home') next = 0;
    else if (event.key === 'End') next = layout.cells.length - 1;
    if (next === null) return;
    event.preventDefault();
    const clamped = Math.max(0, Math.min(layout.cells.length - 1, next));
    setFocusIndex(clamped);
    buttons.current[clamped]?.focus();
  }

  return (
    <div className="season-calendar">
      <div className="season-calendar__scroll">
        {/* biome-ignore lint/a11y/useSemanticElements: a fieldset would suggest a form; this is a group of day buttons. */}
        <div
          role="group"
          aria-label="Season calendar"
          aria-describedby={helpId}
          className="season-calendar__grid"
          style={
            {
              // A season of a few months gets larger squares; a whole year still fits at 1280 px.
              '--calendar-cell': layout.weeks <= 30 ? '1.25rem' : '0.75rem',
              gridTemplateColumns: `auto repeat(${layout.weeks}, var(--calendar-cell))`,
            } as CSSProperties
          }
          onMouseLeave={() => setShownIndex(null)}
        >
          {layout.months.map((m) => (
            <span
              key={m.key}
              className="season-calendar__month"
              aria-hidden="true"
              style={{ gridColumn: `${m.week + 2} / span 4`, gridRow: 1 }}
            >
              {m.label}
            </span>
          ))}
          {WEEKDAYS.map((name, i) => (
            <span
              key={name}
              className="season-calendar__weekday"
              aria-hidden="true"
              style={{ gridColumn: 1, gridRow: i + 2 }}
            >
              {i % 2 === 0 ? name : ''}
            </span>
          ))}
          {layout.cells.map((cell, i) => {
            const details = dayDetails(cell.day, settings);
            return (
              <button
                key={cell.day.date}
                ref={(el) => {
                  buttons.current[i] = el;
                }}
                type="button"
                className={[
                  'season-calendar__day',
                  cell.day.regime === null ? 'season-calendar__day--none' : '',
                  shownIndex === i ? 'is-shown' : '',
                ].join(' ')}
                style={{
                  gridColumn: cell.week + 2,
                  gridRow: cell.weekday + 2,
                  background: colourOf(styles, cell.day.regime),
                }}
                aria-label={`${formatDay(cell.day.date)}: ${cell.day.regime ?? 'no data'}`}
                title={details.map((d) => `${d.term}: ${d.value}`).join('\n')}
                tabIndex={i === stop ? 0 : -1}
                onMouseEnter={() => setShownIndex(i)}
                onFocus={() => {
                  setFocusIndex(i);
                  setShownIndex(i);
                }}
                onClick={() => setShownIndex(i)}
                onKeyDown={(e) => move(e, i)}
              />
            );
          })}
        </div>
      </div>
      <p id={helpId} className="cds--label-description">
        Tab into the calendar, then use the arrow keys: up and down move a day, left and right a week.
      </p>
      <aside className="season-calendar__readout" aria-live="polite" aria-label="Day in focus">
        {shown ? (
          <dl>
            {dayDetails(shown, settings).map((d) => (
              <div key={d.term}>
                <dt>{d.term}</dt>
                <dd>{d.value}</dd>
              </div>
            ))}
          </dl>
        ) : (
          <p>Point at a day, or move to it with the keyboard, to see its anomalies and regime.</p>
        )}
      </aside>
    </div>
  );
}
