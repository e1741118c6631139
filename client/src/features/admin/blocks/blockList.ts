import type { BlockImportResult, BlockView } from '@stormhour/shared';

export interface BlockFilter {
  /** Matched against code and name, ignoring case. */
  query: string;
  /** Null for every district. */
  districtId: number | null;
}

export function filterBlocks(blocks: readonly BlockView[], filter: BlockFilter): BlockView[] {
  const needle = filter.query.trim().toLocaleLowerCase();
  return blocks.filter(
    (block) =>
      (filter.districtId === null || block.districtId === filter.districtId) &&
      (needle === '' ||
        block.code.toLocaleLowerCase().includes(needle) ||
        block.name.toLocaleLowerCase().includes(needle)),
  );
}

const oneDecimal = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

export function formatArea(km2: number): string {
  return oneDecimal.format(km2);
}

function count(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function importSummary(result: BlockImportResult): string {
  return `Imported: ${count(result.blocksCreated, 'block', 'blocks')} created, ${result.blocksUpdated} updated, ${count(result.districtsCreated, 'district', 'districts')} created`;
}

const ACCEPTED_EXTENSIONS = ['.geojson', '.json'];

export function isBoundaryFile(fileName: string): boolean {
  const lower = fileName.toLowerCase();
  return ACCEPTED_EXTENSIONS.some((ext) => lower.endsWith(ext));
}

export const BOUNDARY_FILE_ACCEPT = ACCEPTED_EXTENSIONS;
