import { InlineLoading, Link } from '@carbon/react';
import type { TrackView } from '@stormhour/shared';
import { Link as RouterLink, useParams } from 'react-router';
import { LoadError } from '../../../../components/LoadError';
import { RegionBoundary } from '../../../../components/RegionBoundary';
import { paths } from '../../../../config/paths';
import { CELL_TYPE_TEXT } from '../../intakeWords';
import { useSites } from '../../sites/api';
import { formatSiteTime, formatUtcOffset } from '../../siteTime';
import { useTrack } from '../api';
import { formatHeading, formatOneDecimal, onsetText } from '../trackFormat';
import { TrackCellsTable } from './TrackCellsTable';
import { TrackPathMap } from './TrackPathMap';
import { TrackPlots } from './TrackPlots';

function TrackFacts({ track, offset }: { track: TrackView; offset: number }) {
  const facts: [string, React.ReactNode][] = [
    ['Start', `${formatSiteTime(track.firstTime, offset)} (${formatUtcOffset(offset)})`],
    ['End', `${formatSiteTime(track.lastTime, offset)} (${formatUtcOffset(offset)})`],
    ['Duration', `${Math.round(track.durationMin)} min over ${track.scanCount} scans`],
    ['Start block', track.startBlockCode ?? 'outside the blocks'],
    ['Speed', track.speedMs === null ? '—' : `${formatOneDecimal(track.speedMs)} m/s`],
    ['Heading (moving toward)', formatHeading(track.directionToDeg)],
    ['Max volume', track.maxVolumeKm3 === null ? '—' : `${formatOneDecimal(track.maxVolumeKm3)} km³`],
    ['Max echo top', track.maxEchoTopKm === null ? '—' : `${formatOneDecimal(track.maxEchoTopKm)} km`],
    ['Type', track.cellType ? CELL_TYPE_TEXT[track.cellType] : '—'],
    ['Counted as a storm', track.isStorm ? 'Yes' : 'No, too few scans'],
    ['Onset', onsetText(track)],
    ['Settings version', `v${track.settingsVersion}`],
  ];
  if (track.parentTrackId !== null) {
    facts.push([
      'Split from',
      <Link key="parent" as={RouterLink} to={paths.intake.track(track.parentTrackId)}>
        Track {track.parentTrackId}
      </Link>,
    ]);
  }
  return (
    <dl className="job-facts">
      {facts.map(([term, value]) => (
        <div key={term} className="job-facts__row">
          <dt>{term}</dt>
          <dd>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function TrackDetail({ id }: { id: number }) {
  const detail = useTrack(id);
  const sites = useSites();
  if (detail.isPending) return <InlineLoading description="Loading the track" />;
  if (detail.isError) return <LoadError what="the track" error={detail.error} onRetry={detail.refetch} />;
  const { track, cells } = detail.data;
  const site = sites.data?.find((s) => s.id === track.siteId);
  const offset = site?.utcOffsetMinutes ?? 0;
  return (
    <>
      <h2 className="section-title">
        Track {track.id}
        {site ? ` at ${site.code}` : ''}
      </h2>
      <TrackFacts track={track} offset={offset} />
      <h3 className="section-title">Path</h3>
      <RegionBoundary region="the track’s map">
        <TrackPathMap trackId={track.id} cells={cells} />
      </RegionBoundary>
      <h3 className="section-title">Life of the storm</h3>
      <TrackPlots cells={cells} offsetMinutes={offset} />
      <h3 className="section-title">Cells</h3>
      <TrackCellsTable cells={cells} offsetMinutes={offset} />
    </>
  );
}

export default function TrackDetailPage() {
  const { trackId } = useParams();
  return (
    <>
      <Link as={RouterLink} to={paths.intake.tracks}>
        Back to tracks
      </Link>
      <TrackDetail id={Number(trackId)} />
    </>
  );
}
