import { Link } from '@carbon/react';
import type { BlockScore } from '@stormhour/shared';
import { useMemo, useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { SortableTable } from '../../../components/SortableTable';
import { TableSearch } from '../../../components/TableSearch';
import { paths } from '../../../config/paths';
import { formatNumber } from '../scorecardFormat';

const HEADERS = [
  { key: 'block', header: 'Block' },
  { key: 'brier', header: 'Brier score' },
  { key: 'skill', header: 'Skill' },
  { key: 'pairs', header: 'Days scored' },
  { key: 'events', header: 'Storm afternoons' },
  { key: 'bulletins', header: 'Bulletins' },
];

/** Blocks worst first (highest Brier score), sortable by any column, with links to their bulletins. */
export function WorstBlocksTable({ blocks }: { blocks: BlockScore[] }) {
  const [search, setSearch] = useState('');
  const byCode = useMemo(() => new Map(blocks.map((b) => [b.blockCode, b])), [blocks]);
  const needle = search.trim().toLowerCase();
  const rows = blocks
    .filter((b) => !needle || `${b.blockName} ${b.blockCode}`.toLowerCase().includes(needle))
    .map((b) => ({
      id: b.blockCode,
      block: `${b.blockName} (${b.blockCode})`,
      brier: b.brier,
      // No skill (no usual chance) sorts as the worst.
      skill: b.skill ?? Number.NEGATIVE_INFINITY,
      pairs: b.pairs,
      events: b.events,
      // The block's code, so the cell can find its bulletins.
      bulletins: b.blockCode,
    }));

  return (
    <SortableTable
      label="Blocks, worst scored first"
      headers={HEADERS}
      rows={rows}
      toolbar={{
        label: 'Block filters',
        content: (
          <TableSearch
            labelText="Find a block"
            placeholder="Block name or code"
            value={search}
            onSearch={setSearch}
          />
        ),
      }}
      empty={needle ? 'No block matches.' : 'No block was scored.'}
      cellClassName={(header) =>
        ['brier', 'skill', 'pairs', 'events'].includes(header) ? 'numeric' : undefined
      }
      renderCell={(header, value) => {
        if (header === 'brier') return formatNumber(value as number);
        if (header === 'skill') return formatNumber(Number.isFinite(value) ? (value as number) : null);
        if (header === 'bulletins') {
          const block = byCode.get(value as string);
          return (
            <span className="scorecard-bulletin-links">
              {block?.bulletins.map((b) => (
                <Link key={b.id} as={RouterLink} to={paths.bulletins.bulletin(b.id)}>
                  {b.number}
                </Link>
              ))}
            </span>
          );
        }
        return value as string;
      }}
    />
  );
}
