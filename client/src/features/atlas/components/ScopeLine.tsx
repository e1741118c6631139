import type { AtlasScope } from '@stormhour/shared';

const SOURCE_NAMES: Record<string, string> = {
  'cell-table': 'cell table',
  volume: 'radar volumes',
  'column-max': 'column maximum',
};

/** One sentence on what a view rests on: source, days, onsets, and the sources not added in. */
export function ScopeLine({ scope }: { scope: AtlasScope }) {
  const others = scope.onsetsBySource.filter((s) => s.source !== scope.source && s.onsets > 0);
  return (
    <p className="atlas-scope" aria-live="polite">
      {scope.onsets} onsets on {scope.days} days from the {SOURCE_NAMES[scope.source]}
      {scope.regime ? `, regime ${scope.regime}` : ''}
      {scope.cellType ? `, ${scope.cellType} cells` : ''}.
      {others.length > 0
        ? ` Other sources are shown on their own, never added: ${others.map((s) => `${SOURCE_NAMES[s.source]} ${s.onsets}`).join(', ')}.`
        : ''}
    </p>
  );
}
