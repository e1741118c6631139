import { InlineLoading } from '@carbon/react';
import { BlockMap } from '../../../../components/BlockMap';
import { LoadError } from '../../../../components/LoadError';
import { useBlocksGeojson } from '../api';

export function BlocksMapPanel() {
  const outlines = useBlocksGeojson();
  if (outlines.isPending) return <InlineLoading description="Loading block outlines" />;
  if (outlines.isError)
    return <LoadError what="the block outlines" error={outlines.error} onRetry={outlines.refetch} />;
  if (outlines.data.features.length === 0) return <p>The map appears once blocks have been imported.</p>;
  return <BlockMap blocks={outlines.data} label="Map of blocks" />;
}
