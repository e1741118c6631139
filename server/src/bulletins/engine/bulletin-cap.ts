import { type BulletinContent, type GeoPolygonal, listInWords } from '@stormhour/shared';
import { percent } from './bulletin-text.js';
import { buildCapAlert, type CapAlertInput, capTime, type LonLatRing } from './cap.js';
import { localToUtc } from './local-week.js';
import { richTextPlain } from './rich-text.js';

/** A bulletin version as a CAP 1.2 alert: one area per block with a chance, its polygons' outer rings. */

export interface BulletinCapOptions {
  version: number;
  /** The sender's e-mail address (CAP 1.2 §3.2.1 "sender"). */
  sender: string;
  sent: Date;
  utcOffsetMinutes: number;
  status: CapAlertInput['status'];
  geometryByBlock: Map<string, GeoPolygonal>;
  /** A withdrawal cancels the earlier alert: "sender,identifier,sent" of it. */
  cancels?: { identifier: string; sent: Date; reason: string };
}

export function capIdentifier(c: BulletinContent, version: number): string {
  return `stormhour-${c.number}-v${version}`;
}

export function outerRings(g: GeoPolygonal): LonLatRing[] {
  const polygons = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
  return polygons.map((p) => p[0] as LonLatRing);
}

export function bulletinCapInput(c: BulletinContent, o: BulletinCapOptions): CapAlertInput {
  const withChance = c.outlook.filter((b) => b.afternoonChance !== null);
  const highest = withChance.reduce((m, b) => Math.max(m, b.afternoonChance as number), 0);
  const top = withChance.filter((b) => b.afternoonChance === highest).map((b) => b.blockName);
  const effective = localToUtc(`${c.weekStart}T00:00`, o.utcOffsetMinutes) as Date;
  const expires = new Date(effective.getTime() + 7 * 86_400_000);
  const identifier = o.cancels ? `${capIdentifier(c, o.version)}-withdrawn` : capIdentifier(c, o.version);
  const headline = o.cancels
    ? `${c.districtName} bulletin ${c.number} withdrawn`
    : withChance.length
      ? `${c.districtName}: afternoon storm chance up to ${percent(highest)} (${listInWords(top)}), ${c.weekStart} to ${c.weekEnd}`
      : `${c.districtName}: no storm chances for ${c.weekStart} to ${c.weekEnd} (no radar data)`;
  return {
    identifier,
    sender: o.sender,
    sent: o.sent,
    effective,
    expires,
    utcOffsetMinutes: o.utcOffsetMinutes,
    status: o.status,
    msgType: o.cancels ? 'Cancel' : 'Alert',
    references: o.cancels
      ? [`${o.sender},${o.cancels.identifier},${capTime(o.cancels.sent, o.utcOffsetMinutes)}`]
      : undefined,
    note: o.cancels ? `Withdrawn: ${o.cancels.reason}` : undefined,
    infos: [
      {
        language: 'en',
        event: 'Afternoon thunderstorm outlook',
        headline,
        description: [
          richTextPlain(c.summary),
          ...c.outlook.map((b) => `${b.blockName}: ${percent(b.afternoonChance)}. ${b.inWords}`),
        ].join('\n'),
        instruction: [richTextPlain(c.generalAdvice), ...c.cautions].join('\n'),
        senderName: c.unitName,
        highestChance: highest,
        areas: c.outlook
          .filter((b) => o.geometryByBlock.has(b.blockCode))
          .map((b) => ({
            areaDesc: `${b.blockName} block: afternoon storms ${b.inWords} (${percent(b.afternoonChance)})`,
            rings: outerRings(o.geometryByBlock.get(b.blockCode) as GeoPolygonal),
          })),
      },
    ],
  };
}

export function bulletinCapXml(c: BulletinContent, o: BulletinCapOptions): string {
  return buildCapAlert(bulletinCapInput(c, o));
}
