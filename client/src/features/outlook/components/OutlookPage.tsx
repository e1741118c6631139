import {
  Button,
  InlineLoading,
  InlineNotification,
  NumberInput,
  Select,
  SelectItem,
  TextInput,
} from '@carbon/react';
import { ALL_DAYS, type OutlookResponse, type SiteView, SMALL_N } from '@stormhour/shared';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { useBlocksGeojson } from '../../../api/blocks';
import { LoadError } from '../../../components/LoadError';
import { SitePeriodFields } from '../../../components/SitePeriodFields';
import { useSites } from '../../intake/sites/api';
import { fetchOutlookCsv, type OutlookParams, useExpectedWeekRegime, useOutlook } from '../api';
import { BlockFigures } from './BlockFigures';
import { DiurnalPlot } from './DiurnalPlot';
import { OutlookMap } from './OutlookMap';
import { OutlookTable } from './OutlookTable';

const EXPECTED = 'expected';

const addDays = (date: string, days: number) =>
  new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

type Patch = Partial<Record<string, string>>;

function Controls({
  sites,
  search,
  regimes,
  onChange,
}: {
  sites: SiteView[];
  search: URLSearchParams;
  regimes: { regime: string; days: number }[];
  onChange: (patch: Patch) => void;
}) {
  const get = (key: string, fallback: string) => search.get(key) || fallback;
  return (
    <div className="track-filters outlook-controls">
      <SitePeriodFields
        idPrefix="outlook"
        sites={sites}
        siteId={get('site', String(sites[0]?.id ?? ''))}
        from={search.get('from')}
        to={search.get('to')}
        onChange={onChange}
      />
      <Select
        id="outlook-regime"
        labelText="Regime"
        value={get('regime', ALL_DAYS)}
        onChange={(e) => onChange({ regime: e.target.value })}
      >
        <SelectItem value={ALL_DAYS} text="All days (climatology)" />
        {regimes.map((r) => (
          <SelectItem key={r.regime} value={r.regime} text={`${r.regime} (${r.days} days)`} />
        ))}
        <SelectItem value={EXPECTED} text="Expected for a coming week…" />
      </Select>
      <Select
        id="outlook-bins"
        labelText="Bin width"
        value={get('bins', '3')}
        onChange={(e) => onChange({ bins: e.target.value })}
      >
        {[1, 2, 3, 4, 6].map((h) => (
          <SelectItem key={h} value={String(h)} text={`${h} hour${h > 1 ? 's' : ''}`} />
        ))}
      </Select>
      <Select
        id="outlook-measure"
        labelText="Count"
        value={get('measure', 'onsets')}
        onChange={(e) => onChange({ measure: e.target.value })}
      >
        <SelectItem value="onsets" text="Storms starting (onsets)" />
        <SelectItem value="presence" text="Any storm cell over the block" />
      </Select>
      <NumberInput
        id="outlook-radius"
        label="Neighbourhood (km)"
        helperText="Also count storms this close to a block"
        min={0}
        max={50}
        value={Number(get('r', '0'))}
        onChange={(_e, { value }) => onChange({ r: String(value) })}
      />
      <Select
        id="outlook-interval"
        labelText="Interval"
        value={get('interval', 'jeffreys')}
        onChange={(e) => onChange({ interval: e.target.value })}
      >
        <SelectItem value="jeffreys" text="Jeffreys (90 %)" />
        <SelectItem value="wilson" text="Wilson (90 %)" />
      </Select>
      <NumberInput
        id="outlook-afternoon-from"
        label="Afternoon from (h)"
        min={0}
        max={23}
        value={Number(get('af', '12'))}
        onChange={(_e, { value }) => onChange({ af: String(value) })}
      />
      <NumberInput
        id="outlook-afternoon-to"
        label="Afternoon to (h)"
        min={1}
        max={24}
        value={Number(get('at', '18'))}
        onChange={(_e, { value }) => onChange({ at: String(value) })}
      />
    </div>
  );
}

/** The week picker of "expected for a coming week": the regime forecast grids give, or a hand pick. */
function ExpectedWeek({
  siteId,
  week,
  regimes,
  picked,
  onChange,
}: {
  siteId: number;
  week: string;
  regimes: { regime: string; days: number }[];
  picked: string;
  onChange: (patch: Patch) => void;
}) {
  const expected = useExpectedWeekRegime(week ? { siteId, from: week, to: addDays(week, 6) } : null);
  return (
    <div className="outlook-expected">
      <TextInput
        id="outlook-week"
        type="date"
        labelText="Week starting (local)"
        value={week}
        onChange={(e) => onChange({ week: e.target.value })}
      />
      {!week ? <p>Pick the first day of the coming week.</p> : null}
      {expected.isPending && week ? <InlineLoading description="Looking for forecast grids" /> : null}
      {expected.isError ? (
        <LoadError what="the expected regime" error={expected.error} onRetry={expected.refetch} />
      ) : null}
      {expected.isSuccess && expected.data?.regime ? (
        <InlineNotification
          kind="info"
          lowContrast
          hideCloseButton
          title={`Forecast grids classify ${expected.data.days.length} day(s) of the week: “${expected.data.regime}”.`}
        />
      ) : null}
      {expected.isSuccess && !expected.data?.regime ? (
        <>
          <InlineNotification
            kind="warning"
            lowContrast
            hideCloseButton
            title="No forecast grids uploaded for this week — pick the regime by hand."
          />
          <Select
            id="outlook-hand-regime"
            labelText="Regime picked by hand"
            value={picked}
            onChange={(e) => onChange({ pick: e.target.value })}
          >
            <SelectItem value="" text="Choose a regime" />
            {regimes.map((r) => (
              <SelectItem key={r.regime} value={r.regime} text={r.regime} />
            ))}
          </Select>
        </>
      ) : null}
    </div>
  );
}

function download(name: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'text/csv' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  // Revoked later: revoking at once can cancel the download in some browsers.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

function OutlookBody({ outlook, params }: { outlook: OutlookResponse; params: OutlookParams }) {
  const outlines = useBlocksGeojson();
  const [selected, setSelected] = useState<number | null>(null);
  const [exporting, setExporting] = useState<'idle' | 'busy' | 'done' | Error>('idle');
  const block =
    outlook.blocks.find((b) => b.blockId === selected) ?? outlook.blocks.find((b) => b.hasData) ?? null;
  const regimeText = outlook.regime === ALL_DAYS ? 'all days' : `“${outlook.regime}” days`;

  async function exportCsv() {
    setExporting('busy');
    try {
      const csv = await fetchOutlookCsv(params);
      download(
        `outlook-${outlook.siteCode}-${outlook.regime === ALL_DAYS ? 'all-days' : outlook.regime.replace(/[^a-z0-9]+/gi, '-')}.csv`,
        csv,
      );
      setExporting('done');
    } catch (error) {
      setExporting(error as Error);
    }
  }

  return (
    <>
      <p className="outlook-summary">
        {outlook.siteCode}, {outlook.from ?? '…'} to {outlook.to ?? '…'}: {outlook.regimeDays} {regimeText} of{' '}
        {outlook.daysInPeriod}; counting{' '}
        {outlook.measure === 'onsets' ? 'storm onsets' : 'storm cells over the block'} from the{' '}
        {outlook.source ?? 'no'} source
        {outlook.sources.length > 1 ? ` (of ${outlook.sources.map((s) => s.source).join(', ')})` : ''};{' '}
        {outlook.radiusKm > 0 ? `storms within ${outlook.radiusKm} km of a block count for it; ` : ''}
        {outlook.interval === 'jeffreys' ? 'Jeffreys' : 'Wilson'} 90 % intervals.
      </p>
      <div className="outlook-actions">
        <Button kind="secondary" size="md" onClick={exportCsv} disabled={exporting === 'busy'}>
          Export CSV
        </Button>
        {exporting === 'busy' ? <InlineLoading description="Preparing the CSV" /> : null}
        {exporting === 'done' ? <span role="status">CSV downloaded.</span> : null}
        {exporting instanceof Error ? (
          <LoadError what="the CSV" error={exporting} onRetry={exportCsv} />
        ) : null}
      </div>
      <ul className="map-legend outlook-legend" aria-label="How to read the table">
        <li>
          <span className="outlook-n">n 118</span> days counted behind the figure
        </li>
        <li>
          <span className="outlook-figure--small">12 % n 7 *</span> fewer than {SMALL_N} days: read with care
        </li>
        <li>
          <span className="outlook-nodata">no data</span> block under{' '}
          {Math.round(outlook.minBlockCoverage * 100)} % inside radar coverage
        </li>
      </ul>
      <OutlookTable outlook={outlook} selectedBlock={block?.blockId ?? null} onSelectBlock={setSelected} />
      <div className="regimes-columns">
        <section aria-labelledby="outlook-map-title">
          <h2 id="outlook-map-title" className="section-title">
            Afternoon chance by block
          </h2>
          {outlines.isSuccess ? (
            <OutlookMap outlook={outlook} outlines={outlines.data} onSelectBlock={setSelected} />
          ) : null}
          {outlines.isPending ? <InlineLoading description="Loading the block outlines" /> : null}
          {outlines.isError ? (
            <LoadError what="the block outlines" error={outlines.error} onRetry={outlines.refetch} />
          ) : null}
        </section>
        <section aria-labelledby="outlook-diurnal-title">
          <h2 id="outlook-diurnal-title" className="section-title">
            Through the day{block ? `: ${block.name}` : ''}
          </h2>
          <Select
            id="outlook-block"
            labelText="Block"
            value={String(block?.blockId ?? '')}
            onChange={(e) => setSelected(Number(e.target.value))}
          >
            {outlook.blocks.map((b) => (
              <SelectItem key={b.blockId} value={String(b.blockId)} text={`${b.name} (${b.code})`} />
            ))}
          </Select>
          {block ? <DiurnalPlot outlook={outlook} block={block} /> : null}
          <p className="plot-note">Bars: raw rate x/n. Lines: 90 % interval. Dots: shrunk estimate.</p>
        </section>
      </div>
      <BlockFigures outlook={outlook} />
    </>
  );
}

export default function OutlookPage() {
  const sites = useSites();
  const [search, setSearch] = useSearchParams();
  const asked = Number(search.get('site'));
  const site = sites.data?.find((s) => s.id === asked) ?? sites.data?.[0] ?? null;
  const choice = search.get('regime') || ALL_DAYS;
  const week = search.get('week') ?? '';
  const picked = search.get('pick') ?? '';
  const expected = useExpectedWeekRegime(
    choice === EXPECTED && site && week ? { siteId: site.id, from: week, to: addDays(week, 6) } : null,
  );
  const regime = choice !== EXPECTED ? choice : (expected.data?.regime ?? (picked || null));
  const params: OutlookParams | null =
    site && regime
      ? {
          siteId: site.id,
          regime,
          from: search.get('from') || null,
          to: search.get('to') || null,
          binHours: Number(search.get('bins') || 3),
          measure: search.get('measure') === 'presence' ? 'presence' : 'onsets',
          radiusKm: Number(search.get('r') || 0),
          interval: search.get('interval') === 'wilson' ? 'wilson' : 'jeffreys',
          afternoonFrom: Number(search.get('af') || 12),
          afternoonTo: Number(search.get('at') || 18),
        }
      : null;
  const outlook = useOutlook(params);
  // The regime list is the period's; keep the last one seen while another regime loads.
  const [regimes, setRegimes] = useState<{ regime: string; days: number }[]>([]);
  if (outlook.data && outlook.data.regimes !== regimes && outlook.data.regime === ALL_DAYS)
    setRegimes(outlook.data.regimes);
  const regimeList = regimes.length ? regimes : (outlook.data?.regimes ?? []);

  function update(patch: Patch) {
    const next = new URLSearchParams(search);
    for (const [key, value] of Object.entries(patch)) {
      if (value) next.set(key, value);
      else next.delete(key);
    }
    setSearch(next, { replace: true });
  }

  return (
    <section aria-labelledby="outlook-title">
      <h1 id="outlook-title" className="page-title">
        Outlook
      </h1>
      <p className="page-lead">
        Each figure is the chance that a storm starts in the block in that part of the day (local time): the
        share of the n past days counted — days of the chosen regime with the radar working — on which at
        least one storm began there, with a 90 % interval for how sure that is; few days mean a wide interval.
        The shrunk estimate borrows strength from the other blocks. The afternoon figure is the chance of at
        least one storm in the afternoon window on a day; the week figure, of at least one afternoon storm in
        seven days, counted from the record. This is statistical guidance from past radar data, not a warning:
        follow the national weather service.
      </p>
      {sites.isPending ? <InlineLoading description="Loading the radar sites" /> : null}
      {sites.isError ? (
        <LoadError what="the radar sites" error={sites.error} onRetry={sites.refetch} />
      ) : null}
      {sites.isSuccess && !site ? <p>No radar sites yet. Add one under Intake, Radar sites.</p> : null}
      {sites.isSuccess && site ? (
        <>
          <Controls sites={sites.data} search={search} regimes={regimeList} onChange={update} />
          {choice === EXPECTED ? (
            <ExpectedWeek
              siteId={site.id}
              week={week}
              regimes={regimeList}
              picked={picked}
              onChange={update}
            />
          ) : null}
          {outlook.isPending && params ? <InlineLoading description="Counting the outlook" /> : null}
          {outlook.isError ? (
            <LoadError what="the outlook" error={outlook.error} onRetry={outlook.refetch} />
          ) : null}
          {outlook.data && params ? <OutlookBody outlook={outlook.data} params={params} /> : null}
        </>
      ) : null}
    </section>
  );
}
