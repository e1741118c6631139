import type { OutlookResponse } from '@stormhour/shared';
import { useCallback, useMemo } from 'react';
import { BlockMap } from '../../../components/BlockMap';
import type { BlockFeatureCollection, BlockFeatureProperties } from '../../../lib/geo/blockFeatures';
import { chanceClasses, chanceColour, describeFigure, mapValue, NO_DATA_FILL } from '../outlookFormat';

const HATCH = 'outlook-no-data-hatch';

/** The afternoon chance per block (shrunk estimate), "no data" hatched grey; each block focusable with a readout. */
export function OutlookMap({
  outlook,
  outlines,
  onSelectBlock,
}: {
  outlook: OutlookResponse;
  outlines: BlockFeatureCollection;
  /** Picks the block whose daily cycle is drawn beside the map. */
  onSelectBlock?: (blockId: number) => void;
}) {
  const byId = useMemo(() => new Map(outlook.blocks.map((b) => [b.blockId, b])), [outlook.blocks]);
  const top = useMemo(() => {
    const values = outlook.blocks.map(mapValue).filter((v): v is number => v !== null);
    // Round the scale's top up to a whole 5 %, so the legend reads cleanly.
    return Math.max(0.05, Math.ceil(Math.max(0, ...values) * 20) / 20);
  }, [outlook.blocks]);
  const fillOf = useCallback(
    (p: BlockFeatureProperties) => {
      const b = byId.get(p.id);
      const v = b ? mapValue(b) : null;
      return v === null ? `url(#${HATCH})` : chanceColour(v, top);
    },
    [byId, top],
  );
  const describe = useCallback(
    (p: BlockFeatureProperties) => {
      const b = byId.get(p.id);
      if (!b) return 'not in this outlook';
      if (!b.hasData) return `no data (${(b.coverage * 100).toFixed(0)} % inside coverage)`;
      return `afternoon ${describeFigure(b.afternoon)}; shrunk ${((b.afternoon.shrunk ?? 0) * 100).toFixed(0)} %`;
    },
    [byId],
  );
  const range = `${outlook.afternoon.fromHour}–${outlook.afternoon.toHour}`;
  return (
    <div>
      <BlockMap
        blocks={outlines}
        label={`Map of the afternoon chance (${range} local) per block`}
        fillOf={fillOf}
        describe={describe}
        width={640}
        height={420}
        onPick={onSelectBlock}
        overlay={() => (
          <defs>
            <pattern
              id={HATCH}
              width="6"
              height="6"
              patternUnits="userSpaceOnUse"
              patternTransform="rotate(45)"
            >
              <rect width="6" height="6" fill={NO_DATA_FILL} />
              <line x1="0" y1="0" x2="0" y2="6" stroke="#8d8d8d" strokeWidth="2" />
            </pattern>
          </defs>
        )}
      />
      <ul className="map-legend" aria-label={`Afternoon chance (${range} local)`}>
        {chanceClasses(top).map((c) => (
          <li key={c.label}>
            <span className="map-legend__swatch" style={{ background: c.colour }} aria-hidden="true" />
            {c.label}
          </li>
        ))}
        <li>
          <span className="map-legend__swatch outlook-hatch-swatch" aria-hidden="true" />
          no data
        </li>
      </ul>
    </div>
  );
}
