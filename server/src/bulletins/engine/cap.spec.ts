import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import {
  buildCapAlert,
  CAP_NAMESPACE,
  type CapAlertInput,
  capCertainty,
  capPolygon,
  capTime,
} from './cap.js';

// Enumerations and required elements: OASIS Common Alerting Protocol 1.2 (2010), §3.2 (see the team's
// REFERENCES.md §13). The parser is fast-xml-parser, a general-purpose XML parser from the registry.
const STATUS = ['Actual', 'Exercise', 'System', 'Test', 'Draft'];
const MSG_TYPE = ['Alert', 'Update', 'Cancel', 'Ack', 'Error'];
const SCOPE = ['Public', 'Restricted', 'Private'];
const CATEGORY = ['Geo', 'Met', 'Safety', 'Security', 'Rescue', 'Fire', 'Health', 'Env', 'Transport'];
const URGENCY = ['Immediate', 'Expected', 'Future', 'Past', 'Unknown'];
const SEVERITY = ['Extreme', 'Severe', 'Moderate', 'Minor', 'Unknown'];
const CERTAINTY = ['Observed', 'Likely', 'Possible', 'Unlikely', 'Unknown'];
const RESPONSE = [
  'Shelter',
  'Evacuate',
  'Prepare',
  'Execute',
  'Avoid',
  'Monitor',
  'Assess',
  'AllClear',
  'None',
];
// CAP 1.2 §3.3.2: date-times with an explicit offset; "Z" is not allowed.
const CAP_TIME = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d[+-]\d\d:\d\d$/;

const square: [number, number][] = [
  [88.1, 14.1],
  [88.2, 14.1],
  [88.2, 14.2],
  [88.1, 14.2],
  [88.1, 14.1],
];

function input(overrides: Partial<CapAlertInput> = {}): CapAlertInput {
  return {
    identifier: 'stormhour-RB-2025-27-v2',
    sender: 'bulletins@stormhour.invalid',
    sent: new Date('2025-07-07T03:30:00Z'),
    effective: new Date('2025-07-07T00:00:00Z'),
    expires: new Date('2025-07-13T18:00:00Z'),
    utcOffsetMinutes: 360,
    status: 'Actual',
    msgType: 'Alert',
    infos: [
      {
        language: 'en',
        event: 'Afternoon thunderstorm outlook',
        headline: 'Riverbend: afternoon storms likely on most days',
        description: 'Chance of storms < 1 in 2 & rising',
        instruction: 'Spray in the morning.',
        senderName: 'Agro-met unit',
        highestChance: 0.62,
        areas: [{ areaDesc: 'Ashgrove', rings: [square] }],
      },
    ],
    ...overrides,
  };
}

function parse(xml: string) {
  expect(XMLValidator.validate(xml)).toBe(true);
  const doc = new XMLParser({
    ignoreAttributes: false,
    isArray: (n) => ['info', 'area', 'polygon'].includes(n),
  }).parse(xml);
  return doc.alert;
}

describe('CAP 1.2 alert', () => {
  it('has every required element with an allowed value (OASIS CAP 1.2 §3.2)', () => {
    const alert = parse(buildCapAlert(input()));
    expect(alert['@_xmlns']).toBe(CAP_NAMESPACE);
    for (const name of ['identifier', 'sender', 'sent', 'status', 'msgType', 'scope']) {
      expect(String(alert[name] ?? '').length, name).toBeGreaterThan(0);
    }
    expect(STATUS).toContain(alert.status);
    expect(MSG_TYPE).toContain(alert.msgType);
    expect(SCOPE).toContain(alert.scope);
    expect(alert.sent).toMatch(CAP_TIME);
    const [info] = alert.info;
    expect(CATEGORY).toContain(info.category);
    expect(URGENCY).toContain(info.urgency);
    expect(SEVERITY).toContain(info.severity);
    expect(CERTAINTY).toContain(info.certainty);
    expect(RESPONSE).toContain(info.responseType);
    expect(String(info.event).length).toBeGreaterThan(0);
    expect(info.effective).toMatch(CAP_TIME);
    expect(info.expires).toMatch(CAP_TIME);
    expect(info.area[0].areaDesc).toBe('Ashgrove');
  });

  it('escapes text so markup in advice cannot break the document', () => {
    const alert = parse(buildCapAlert(input()));
    expect(alert.info[0].description).toBe('Chance of storms < 1 in 2 & rising');
  });

  it('writes polygons as closed rings of "lat,lon" pairs, at least four (CAP 1.2 §3.2.4 polygon)', () => {
    const alert = parse(buildCapAlert(input()));
    const pairs = String(alert.info[0].area[0].polygon[0]).split(' ');
    expect(pairs.length).toBeGreaterThanOrEqual(4);
    expect(pairs[0]).toBe(pairs[pairs.length - 1]);
    // Latitude first: the square lies at 14° N, 88° E.
    expect(pairs[0]).toBe('14.1,88.1');
  });

  it('closes an open ring and refuses a degenerate one', () => {
    expect(capPolygon(square.slice(0, 4)).split(' ')).toHaveLength(5);
    expect(() => capPolygon(square.slice(0, 2))).toThrow(/at least 4 points/);
  });

  it('carries the references of the alert a correction updates', () => {
    const refs = ['bulletins@stormhour.invalid,stormhour-RB-2025-27-v1,2025-07-06T09:00:00+06:00'];
    const alert = parse(buildCapAlert(input({ msgType: 'Update', references: refs })));
    expect(alert.msgType).toBe('Update');
    expect(alert.references).toBe(refs[0]);
  });

  it.each([
    // CAP 1.2 certainty: Likely p > ~50 %, Possible p <= ~50 %, Unlikely p ~ 0 (our line: 5 %).
    [0.62, 'Likely'],
    [0.5, 'Possible'],
    [0.06, 'Possible'],
    [0.05, 'Unlikely'],
    [0, 'Unlikely'],
  ])('chance %f is certainty %s', (p, certainty) => {
    expect(capCertainty(p)).toBe(certainty);
  });

  it.each([
    // CAP 1.2 §3.3.2 examples: "2002-05-24T16:49:00-07:00"; UTC is written "-00:00".
    [new Date('2025-07-07T03:30:00Z'), 360, '2025-07-07T09:30:00+06:00'],
    [new Date('2025-07-07T03:30:00Z'), 0, '2025-07-07T03:30:00-00:00'],
    [new Date('2025-07-07T03:30:00Z'), 345, '2025-07-07T09:15:00+05:45'],
    [new Date('2025-07-07T03:30:00Z'), -420, '2025-07-06T20:30:00-07:00'],
  ])('writes %s at offset %i min as %s', (at, offset, expected) => {
    expect(capTime(at, offset)).toBe(expected);
  });
});
