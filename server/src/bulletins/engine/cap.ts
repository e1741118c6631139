import { create } from 'xmlbuilder2';

/**
 * A bulletin as an OASIS Common Alerting Protocol 1.2 alert: one alert, one info per language, one area
 * per block with the block's polygons. Framework-free so it can be tested against the standard alone.
 */

export const CAP_NAMESPACE = 'urn:oasis:names:tc:emergency:cap:1.2';

export type CapCertainty = 'Likely' | 'Possible' | 'Unlikely';
export type CapSeverity = 'Moderate' | 'Minor';
export type CapResponse = 'Prepare' | 'Monitor';

/** A ring of [lon, lat] positions, as GeoJSON writes them. */
export type LonLatRing = [number, number][];

export interface CapArea {
  /** Shown to people, e.g. "Ashgrove block: afternoon storms about 1 day in 2 (48 %)". */
  areaDesc: string;
  /** Outer rings of the block's polygons; CAP polygons cannot carry holes. */
  rings: LonLatRing[];
}

export interface CapInfo {
  /** RFC 3066 language tag, e.g. "en". */
  language: string;
  event: string;
  headline: string;
  description: string;
  instruction: string;
  senderName: string;
  /** The highest chance that the bulletin states for any block (0–1): it sets certainty and severity. */
  highestChance: number;
  areas: CapArea[];
}

export interface CapAlertInput {
  identifier: string;
  sender: string;
  sent: Date;
  effective: Date;
  expires: Date;
  /** Local time of the district = UTC + this offset; CAP times carry the offset. */
  utcOffsetMinutes: number;
  status: 'Actual' | 'Exercise' | 'System' | 'Test' | 'Draft';
  /** "Update" and "Cancel" refer to earlier alerts; a correction after withdrawal is an Update. */
  msgType: 'Alert' | 'Update' | 'Cancel';
  /** Earlier alerts this one updates or cancels: "sender,identifier,sent" each. */
  references?: string[];
  note?: string;
  infos: CapInfo[];
}

/**
 * Chance to CAP certainty, by the standard's own wording: "Likely" is p > ~50 %, "Possible" p ≤ ~50 %,
 * and "Unlikely" not expected (p ≈ 0); we draw that last line at 5 %.
 */
export function capCertainty(chance: number): CapCertainty {
  if (chance > 0.5) return 'Likely';
  if (chance > 0.05) return 'Possible';
  return 'Unlikely';
}

/**
 * Lightning is a threat to life for anyone working in the open, so any thunderstorm the bulletin expects
 * is "Moderate" (possible threat to life or property); when storms are not expected it is "Minor".
 * Severity of a single storm is not something a climatological chance can judge beyond that.
 */
export function capSeverity(chance: number): CapSeverity {
  return capCertainty(chance) === 'Unlikely' ? 'Minor' : 'Moderate';
}

export function capResponse(chance: number): CapResponse {
  return capCertainty(chance) === 'Unlikely' ? 'Monitor' : 'Prepare';
}

/** CAP date-time: local time with its offset, never "Z" (UTC itself is written "-00:00"). */
export function capTime(at: Date, utcOffsetMinutes: number): string {
  const local = new Date(at.getTime() + utcOffsetMinutes * 60_000);
  const stamp = local.toISOString().slice(0, 19);
  if (utcOffsetMinutes === 0) return `${stamp}-00:00`;
  const sign = utcOffsetMinutes > 0 ? '+' : '-';
  const abs = Math.abs(utcOffsetMinutes);
  const hh = String(Math.floor(abs / 60)).padStart(2, '0');
  const mm = String(abs % 60).padStart(2, '0');
  return `${stamp}${sign}${hh}:${mm}`;
}

/** A ring as CAP wants it: space-separated "lat,lon" pairs, closed, at least four of them. */
export function capPolygon(ring: LonLatRing): string {
  const pts = ring.map(([lon, lat]) => [round(lat), round(lon)] as const);
  const [first, last] = [pts[0], pts[pts.length - 1]];
  if (first[0] !== last[0] || first[1] !== last[1]) pts.push(first);
  if (pts.length < 4) throw new Error(`A CAP polygon needs at least 4 points; this ring has ${pts.length}.`);
  return pts.map(([lat, lon]) => `${lat},${lon}`).join(' ');
}

function round(deg: number): number {
  return Math.round(deg * 1e5) / 1e5;
}

export function buildCapAlert(input: CapAlertInput): string {
  const t = (d: Date) => capTime(d, input.utcOffsetMinutes);
  const alert = create({ version: '1.0', encoding: 'UTF-8' }).ele(CAP_NAMESPACE, 'alert');
  const el = (parent: typeof alert, name: string, text: string) => parent.ele(name).txt(text).up();
  el(alert, 'identifier', input.identifier);
  el(alert, 'sender', input.sender);
  el(alert, 'sent', t(input.sent));
  el(alert, 'status', input.status);
  el(alert, 'msgType', input.msgType);
  el(alert, 'scope', 'Public');
  if (input.note) el(alert, 'note', input.note);
  if (input.references?.length) el(alert, 'references', input.references.join(' '));
  for (const info of input.infos) {
    const i = alert.ele('info');
    el(i, 'language', info.language);
    el(i, 'category', 'Met');
    el(i, 'event', info.event);
    el(i, 'responseType', capResponse(info.highestChance));
    // A weekly outlook asks for action within days, not the next hour.
    el(i, 'urgency', 'Future');
    el(i, 'severity', capSeverity(info.highestChance));
    el(i, 'certainty', capCertainty(info.highestChance));
    el(i, 'effective', t(input.effective));
    el(i, 'expires', t(input.expires));
    el(i, 'senderName', info.senderName);
    el(i, 'headline', info.headline);
    el(i, 'description', info.description);
    el(i, 'instruction', info.instruction);
    for (const area of info.areas) {
      const a = i.ele('area');
      el(a, 'areaDesc', area.areaDesc);
      for (const ring of area.rings) el(a, 'polygon', capPolygon(ring));
      a.up();
    }
    i.up();
  }
  return alert.end({ prettyPrint: true });
}
