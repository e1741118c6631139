import {
  BLOCK_FEATURE_PROPERTIES,
  type FeatureProblem,
  type GeoPolygonal,
  RegionCode,
} from '@stormhour/shared';
import kinks from '@turf/kinks';

/** A feature that passed every check, ready to store. */
export interface ParsedBlock {
  feature: number;
  districtCode: string;
  districtName: string;
  code: string;
  name: string;
  geometry: GeoPolygonal;
}

export type ImportCheck =
  | { ok: true; blocks: ParsedBlock[] }
  | { ok: false; fileProblem?: string; problems: FeatureProblem[] };

/** Reads a blocks file's text and checks every feature; all problems are reported, not just the first. */
export function checkBlocksFile(text: string): ImportCheck {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    return { ok: false, fileProblem: `The file is not JSON: ${(e as Error).message}`, problems: [] };
  }
  const fc = json as { type?: unknown; features?: unknown };
  if (!fc || typeof fc !== 'object' || fc.type !== 'FeatureCollection' || !Array.isArray(fc.features)) {
    return {
      ok: false,
      fileProblem:
        'The file is not a GeoJSON FeatureCollection (it needs "type": "FeatureCollection" and a "features" list).',
      problems: [],
    };
  }
  if (fc.features.length === 0) return { ok: false, fileProblem: 'The file has no features.', problems: [] };

  const problems: FeatureProblem[] = [];
  const blocks: ParsedBlock[] = [];
  const seenBlock = new Map<string, number>();
  const districtNames = new Map<string, { name: string; feature: number }>();

  fc.features.forEach((raw, index) => {
    const found: string[] = [];
    const feature = raw as {
      type?: unknown;
      geometry?: unknown;
      properties?: Record<string, unknown> | null;
    };
    const props = feature?.properties ?? {};
    const blockCode = typeof props.block_code === 'string' ? props.block_code.trim() : undefined;
    if (feature?.type !== 'Feature') found.push('it is not a GeoJSON Feature');
    found.push(...checkProperties(props));
    const geometry = feature?.geometry as GeoPolygonal | undefined;
    found.push(...checkGeometry(geometry));

    if (blockCode) {
      const first = seenBlock.get(blockCode);
      if (first !== undefined) found.push(`block_code ${blockCode} is also used by feature ${first}`);
      else seenBlock.set(blockCode, index);
    }
    const districtCode = typeof props.district_code === 'string' ? props.district_code.trim() : '';
    const districtName = typeof props.district_name === 'string' ? props.district_name.trim() : '';
    if (districtCode && districtName) {
      const known = districtNames.get(districtCode);
      if (!known) districtNames.set(districtCode, { name: districtName, feature: index });
      else if (known.name !== districtName)
        found.push(
          `district ${districtCode} is named "${districtName}" here but "${known.name}" in feature ${known.feature}`,
        );
    }

    if (found.length) {
      for (const reason of found)
        problems.push({ feature: index, ...(blockCode ? { blockCode } : {}), reason });
    } else if (geometry && blockCode) {
      blocks.push({
        feature: index,
        districtCode,
        districtName,
        code: blockCode,
        name: String(props.block_name).trim(),
        geometry: { type: geometry.type, coordinates: geometry.coordinates } as GeoPolygonal,
      });
    }
  });
  return problems.length ? { ok: false, problems } : { ok: true, blocks };
}

function checkProperties(props: Record<string, unknown>): string[] {
  const out: string[] = [];
  for (const key of BLOCK_FEATURE_PROPERTIES) {
    const value = props[key];
    if (typeof value !== 'string' || value.trim() === '') {
      out.push(`property ${key} is missing or empty`);
      continue;
    }
    if (key.endsWith('_code')) {
      const code = RegionCode.safeParse(value);
      if (!code.success) out.push(`${key} "${value}" is not a valid code: ${code.error.issues[0].message}`);
    }
  }
  return out;
}

function checkGeometry(g: GeoPolygonal | undefined): string[] {
  if (!g || typeof g !== 'object') return ['it has no geometry'];
  if (g.type !== 'Polygon' && g.type !== 'MultiPolygon')
    return [
      `its geometry is a ${String((g as { type?: unknown }).type)}; blocks must be Polygon or MultiPolygon`,
    ];
  if (!Array.isArray(g.coordinates)) return ['its geometry has no coordinates'];
  const parts = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
  const out: string[] = [];
  parts.forEach((rings, p) => {
    const where = g.type === 'MultiPolygon' ? `part ${p} ` : '';
    if (!Array.isArray(rings) || rings.length === 0) {
      out.push(`${where}has no rings`);
      return;
    }
    rings.forEach((ring, r) => {
      out.push(...checkRing(ring, `${where}ring ${r}`));
    });
  });
  if (out.length) return out;
  const crossings = kinks({ type: 'Feature', properties: {}, geometry: g }).features;
  if (crossings.length) {
    const [lon, lat] = crossings[0].geometry.coordinates;
    out.push(
      `its boundary crosses itself (${crossings.length} crossing${crossings.length > 1 ? 's' : ''}, the first near ${lat.toFixed(5)}, ${lon.toFixed(5)})`,
    );
  }
  return out;
}

function checkRing(ring: unknown, where: string): string[] {
  if (!Array.isArray(ring)) return [`${where} is not a list of positions`];
  if (ring.length < 4)
    return [`${where} has ${ring.length} positions; a ring needs at least 4 (3 corners and the closing one)`];
  for (let i = 0; i < ring.length; i++) {
    const pos = ring[i] as unknown;
    if (
      !Array.isArray(pos) ||
      pos.length < 2 ||
      !pos.slice(0, 2).every((v) => typeof v === 'number' && Number.isFinite(v))
    )
      return [`${where} position ${i} is not a [longitude, latitude] pair of numbers`];
    const [lon, lat] = pos as number[];
    if (lon < -180 || lon > 180) return [`${where} position ${i} has longitude ${lon}, outside −180…180`];
    if (lat < -90 || lat > 90) return [`${where} position ${i} has latitude ${lat}, outside −90…90`];
  }
  const first = ring[0] as number[];
  const last = ring[ring.length - 1] as number[];
  if (first[0] !== last[0] || first[1] !== last[1])
    return [`${where} is not closed: its last position differs from its first`];
  return [];
}
