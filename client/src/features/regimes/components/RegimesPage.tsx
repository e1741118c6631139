import { Button, InlineLoading, InlineNotification } from '@carbon/react';
import type { RegimesResponse, SiteView } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router';
import { LoadError } from '../../../components/LoadError';
import { SitePeriodFields, type SitePeriodPatch } from '../../../components/SitePeriodFields';
import { useSessionUser } from '../../../lib/auth';
import { useSites } from '../../intake/sites/api';
import { type RegimesParams, useRegimes } from '../api';
import { hasAnomalyData, NO_DATA_COLOUR, regimeStyles } from '../regimeFormat';
import { CompositeMap } from './CompositeMap';
import { FlowScatter } from './FlowScatter';
import { RegimeCounts } from './RegimeCounts';
import { RegimeSettingsModal } from './RegimeSettingsModal';
import { RegimeThresholds } from './RegimeThresholds';
import { SeasonCalendar } from './SeasonCalendar';
import { StoredFields } from './StoredFields';

function PeriodControls({
  sites,
  params,
  onChange,
}: {
  sites: SiteView[];
  params: RegimesParams;
  onChange: (patch: SitePeriodPatch) => void;
}) {
  return (
    <div className="track-filters">
      <SitePeriodFields
        idPrefix="regimes"
        sites={sites}
        siteId={params.siteId}
        from={params.from}
        to={params.to}
        onChange={onChange}
      />
    </div>
  );
}

/** Scientists set how a site's days are classified; a save makes a new version and reclassifies them. */
function SettingsControl({ siteId }: { siteId: number }) {
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState<{ siteId: number; version: number } | null>(null);
  return (
    <div className="regime-settings">
      <Button kind="tertiary" size="sm" onClick={() => setEditing(true)}>
        Edit regime settings
      </Button>
      {saved?.siteId === siteId ? (
        <InlineNotification
          kind="success"
          lowContrast
          title={`Saved as version ${saved.version}; the days are classified again.`}
          onCloseButtonClick={() => setSaved(null)}
        />
      ) : null}
      {editing ? (
        <RegimeSettingsModal
          siteId={siteId}
          onSaved={(version) => setSaved({ siteId, version })}
          onClose={() => setEditing(false)}
        />
      ) : null}
    </div>
  );
}

function RegimesBody({
  regimes,
  params,
  regime,
  onRegime,
}: {
  regimes: RegimesResponse;
  params: RegimesParams;
  regime: string | null;
  onRegime: (regime: string) => void;
}) {
  const styles = useMemo(
    () => regimeStyles(regimes.days, regimes.counts, regimes.settings),
    [regimes.days, regimes.counts, regimes.settings],
  );
  if (!hasAnomalyData(regimes.days)) {
    return (
      <p className="regimes-empty">
        No anomaly grids for this site yet: upload them under Intake (kind: anomaly grid).
      </p>
    );
  }
  const counted = new Set(regimes.counts.filter((c) => c.days > 0).map((c) => c.regime));
  const withDays = styles.filter((s) => counted.has(s.regime));
  const noData = regimes.days.filter((d) => d.regime === null).length;

  return (
    <>
      <RegimeThresholds regimes={regimes} />
      <section aria-labelledby="regimes-calendar-title">
        <h2 id="regimes-calendar-title" className="section-title">
          The season day by day
        </h2>
        <ul className="map-legend" aria-label="Regime colours">
          {styles.map((s) => (
            <li key={s.regime}>
              <span className="map-legend__swatch" style={{ background: s.colour }} aria-hidden="true" />
              {s.regime}
            </li>
          ))}
          <li>
            <span className="map-legend__swatch" style={{ background: NO_DATA_COLOUR }} aria-hidden="true" />
            no data ({noData} {noData === 1 ? 'day' : 'days'})
          </li>
        </ul>
        <SeasonCalendar days={regimes.days} settings={regimes.settings} styles={styles} />
      </section>
      <div className="regimes-columns">
        <section aria-labelledby="regimes-scatter-title">
          <h2 id="regimes-scatter-title" className="section-title">
            Moisture against flow
          </h2>
          <FlowScatter
            days={regimes.days}
            settings={regimes.settings}
            bounds={regimes.moistureBoundsGKg}
            styles={styles}
          />
        </section>
        <section aria-labelledby="regimes-counts-title">
          <h2 id="regimes-counts-title" className="section-title">
            Days per regime
          </h2>
          <RegimeCounts counts={regimes.counts} styles={styles} />
        </section>
      </div>
      <section aria-labelledby="regimes-composite-title">
        <h2 id="regimes-composite-title" className="section-title">
          Composite of a regime
        </h2>
        <CompositeMap params={params} styles={withDays} regime={regime} onRegime={onRegime} />
      </section>
      <section aria-labelledby="regimes-sources-title">
        <h2 id="regimes-sources-title" className="section-title">
          Stored fields
        </h2>
        <StoredFields />
      </section>
    </>
  );
}

export default function RegimesPage() {
  const user = useSessionUser();
  const sites = useSites();
  const [search, setSearch] = useSearchParams();
  const asked = Number(search.get('site'));
  // Without a chosen site, the first one; regimes are always read per site.
  const site = sites.data?.find((s) => s.id === asked) ?? sites.data?.[0] ?? null;
  const params: RegimesParams | null = site
    ? { siteId: site.id, from: search.get('from') || null, to: search.get('to') || null }
    : null;
  const regimes = useRegimes(params);

  function update(patch: Partial<Record<'site' | 'from' | 'to' | 'regime', string>>) {
    const next = new URLSearchParams(search);
    for (const [key, value] of Object.entries(patch)) {
      if (value) next.set(key, value);
      else next.delete(key);
    }
    setSearch(next, { replace: true });
  }

  return (
    <section aria-labelledby="regimes-title">
      <h1 id="regimes-title" className="page-title">
        Regimes
      </h1>
      <p className="page-lead">
        A regime sorts each day by the large-scale weather over the radar coverage: how moist the air was
        against normal (q′, the day’s mean specific humidity anomaly, classed dry, near normal or moist by the
        terciles of the period or by fixed bounds) and the sector the anomaly wind blew from — or “weak” when
        that wind was too light to count.
      </p>
      {sites.isPending ? <InlineLoading description="Loading the radar sites" /> : null}
      {sites.isError ? (
        <LoadError what="the radar sites" error={sites.error} onRetry={sites.refetch} />
      ) : null}
      {sites.isSuccess && !params ? <p>No radar sites yet. Add one under Intake, Radar sites.</p> : null}
      {sites.isSuccess && params ? (
        <>
          <PeriodControls sites={sites.data} params={params} onChange={update} />
          {user.role === 'scientist' ? <SettingsControl siteId={params.siteId} /> : null}
          {regimes.isPending ? <InlineLoading description="Loading the regimes" /> : null}
          {regimes.isError ? (
            <LoadError what="the regimes" error={regimes.error} onRetry={regimes.refetch} />
          ) : null}
          {regimes.isSuccess ? (
            <RegimesBody
              regimes={regimes.data}
              params={params}
              regime={search.get('regime')}
              onRegime={(regime) => update({ regime })}
            />
          ) : null}
        </>
      ) : null}
    </section>
  );
}
