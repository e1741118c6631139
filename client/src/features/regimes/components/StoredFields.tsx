import { type DataTableHeader, InlineLoading } from '@carbon/react';
import { LoadError } from '../../../components/LoadError';
import { SortableTable } from '../../../components/SortableTable';
import { useAnomalySources } from '../api';

const HEADERS: DataTableHeader[] = [
  { key: 'product', header: 'Product' },
  { key: 'variable', header: 'Field' },
  { key: 'what', header: 'Stored as' },
  { key: 'sourceFile', header: 'Source file' },
  { key: 'period', header: 'Days' },
];

const VARIABLE_WORDS = { q: 'q′ (g/kg)', u: 'u′ (m/s)', v: 'v′ (m/s)' } as const;

/**
 * Which anomaly fields are stored and where they came from: analyses (the regimes) or forecasts (the
 * expected regime), uploaded as anomalies or computed from totals minus a climatology.
 */
export function StoredFields() {
  const sources = useAnomalySources();
  if (sources.isPending) return <InlineLoading description="Loading the stored fields" />;
  if (sources.isError)
    return <LoadError what="the stored fields" error={sources.error} onRetry={sources.refetch} />;
  const rows = sources.data.map((s) => ({
    id: `${s.product}-${s.variable}-${s.sourceFile}-${s.derivation}-${s.climatologyFile ?? ''}`,
    product: s.product,
    variable: VARIABLE_WORDS[s.variable],
    what:
      s.derivation === 'anomaly'
        ? 'anomalies as uploaded'
        : `totals − climatology (${s.climatologyFile ?? 'unknown file'})`,
    sourceFile: s.sourceFile,
    period: `${s.days} (${s.first} – ${s.last})`,
  }));
  return (
    <SortableTable
      rows={rows}
      headers={HEADERS}
      label="Stored anomaly fields"
      description="Regimes use analyses only; forecasts give the expected regime of a coming week."
      empty="No anomaly fields are stored yet."
    />
  );
}
