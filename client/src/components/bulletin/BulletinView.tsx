import type { BulletinContent } from '@stormhour/shared';
import { useId } from 'react';
import { chanceText, changeText, hourText, intervalText, windowText } from './bulletinFormat';
import { RichText } from './RichText';

/**
 * A bulletin exactly as an officer reads it in the inbox; the writer's preview is the same component.
 * Plain tables (not sortable): the order is the writer's and must read the same in every copy.
 */
export function BulletinView({ content }: { content: BulletinContent }) {
  const id = useId();
  return (
    <article className="bulletin-view" aria-labelledby={`${id}-title`}>
      <header>
        <h2 id={`${id}-title`} className="bulletin-view__title">
          {content.districtName}: crop-weather bulletin {content.number}
        </h2>
        <p className="bulletin-view__meta">
          Valid {content.weekStart} to {content.weekEnd}, issued {content.issueDate} by {content.unitName}.
          {content.regimeLabel ? (
            <>
              {' '}
              Expected large-scale regime: <strong>{content.regimeLabel}</strong>.
            </>
          ) : null}
        </p>
      </header>
      <RichText source={content.summary} />

      <h3 className="bulletin-view__heading">Chance of an afternoon storm ({windowText(content)})</h3>
      <div className="bulletin-view__scroll">
        <table className="bulletin-table" aria-label="Afternoon storm chance by block">
          <thead>
            <tr>
              <th scope="col">Block</th>
              <th scope="col">Chance</th>
              <th scope="col">90 % interval</th>
              <th scope="col">Days (n)</th>
              <th scope="col">Peak hour</th>
              <th scope="col">In words</th>
              <th scope="col">Change from usual</th>
            </tr>
          </thead>
          <tbody>
            {content.outlook.map((b) => (
              <tr key={b.blockCode}>
                <th scope="row">{b.blockName}</th>
                <td className="num">{chanceText(b.afternoonChance)}</td>
                <td className="num">{intervalText(b)}</td>
                <td className="num">{b.n}</td>
                <td className="num">{hourText(b.peakHourLocal)}</td>
                <td>{b.inWords}</td>
                <td>{changeText(b)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <h3 className="bulletin-view__heading">Crop advice</h3>
      {content.crops.length === 0 ? (
        <p>No crop-specific advice this week.</p>
      ) : (
        <div className="bulletin-view__scroll">
          <table className="bulletin-table" aria-label="Crop advice">
            <thead>
              <tr>
                <th scope="col">Crop</th>
                <th scope="col">Stage</th>
                <th scope="col">Advice</th>
              </tr>
            </thead>
            <tbody>
              {content.crops.map((a, i) => (
                // Two rows may share crop and stage; the position keeps them apart.
                // biome-ignore lint/suspicious/noArrayIndexKey: rows have no identity of their own
                <tr key={i}>
                  <th scope="row">{a.crop}</th>
                  <td>{a.stage}</td>
                  <td>
                    <RichText source={a.advice} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}

      <h3 className="bulletin-view__heading">General advice</h3>
      <RichText source={content.generalAdvice} />

      <h3 className="bulletin-view__heading">Cautions</h3>
      <ul className="bulletin-view__cautions">
        {content.cautions.map((t) => (
          <li key={t}>{t}</li>
        ))}
      </ul>
    </article>
  );
}
