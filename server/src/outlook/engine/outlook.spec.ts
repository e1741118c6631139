import { describe, expect, it } from 'vitest';
import { dayOfDate, HOUR_MS, localDay, localHour, localMidnightUtc } from '../../radar/engine/local-time.js';
import { jeffreysInterval } from './intervals.js';
import { ownBlock } from './neighbourhood.js';
import { afternoonRates, computeOutlook, type OutlookInput } from './outlook.js';
import { countScanHours } from './scan-hours.js';

/** Hourly scans at half past every local hour of the given days, minus the hours listed as outages. */
function hourlyScans(days: number[], offset: number, outages: [day: number, hour: number][] = []) {
  const out: number[] = [];
  for (const d of days)
    for (let h = 0; h < 24; h++)
      if (!outages.some(([od, oh]) => od === d && oh === h))
        out.push(localMidnightUtc(d, offset) + h * HOUR_MS + 30 * 60_000);
  return countScanHours(out, offset);
}

const at = (day: number, offset: number, hour: number, minute = 0) =>
  localMidnightUtc(day, offset) + hour * HOUR_MS + minute * 60_000;

describe('counting the outlook on a hand-made record', () => {
  // Four local days at UTC+06:00, one scan an hour (3 expected in a 3-hour bin; 80 % needs all 3,
  // and 5 of 6 in the afternoon). On day 1 the 15:00–16:00 scan is missing.
  const offset = 360;
  const d0 = dayOfDate('2025-06-01');
  const days = [d0, d0 + 1, d0 + 2, d0 + 3];
  const events: [blockIndex: number, day: number, hour: number, minute: number][] = [
    [0, d0, 13, 30], // A: afternoon bin 12–15, day 0
    [0, d0, 14, 10], // A: same bin, same day: still one day
    [0, d0 + 1, 15, 30], // A: bin 15–18 in the outage: that bin does not count day 1; the afternoon does (5/6)
    [0, d0 + 2, 2, 0], // A: night bin 00–03
    [0, d0 + 3, 13, 0], // A: bin 12–15, day 3
    [1, d0 + 2, 16, 0], // B: bin 15–18, day 2
    [2, d0, 13, 0], // C: half outside coverage, no data
  ];
  const input = (selected: number[]): OutlookInput => ({
    blocks: [
      { coverage: 1, countingAreaKm2: 200 },
      { coverage: 0.9, countingAreaKm2: 100 },
      { coverage: 0.45, countingAreaKm2: 100 },
    ],
    eventTimes: Float64Array.from(events.map(([, d, h, m]) => at(d, offset, h, m))),
    eventBlocks: ownBlock(Int32Array.from(events.map(([b]) => b))),
    scanHours: hourlyScans(days, offset, [[d0 + 1, 15]]),
    days: Int32Array.from(selected),
    utcOffsetMinutes: offset,
    intervalMin: 60,
    binHours: 3,
    afternoon: { fromHour: 12, toHour: 18 },
    minAvailability: 0.8,
    minBlockCoverage: 0.5,
    interval: 'jeffreys',
    level: 0.9,
  });

  it('gives every n, x and rate that counting by hand gives', () => {
    const { blocks } = computeOutlook(input(days));
    const [a, b, c] = blocks;
    // n by hand: 4 days in every bin but 15–18, where day 1's outage leaves 3.
    expect(a.bins.map((f) => f.n)).toEqual([4, 4, 4, 4, 4, 3, 4, 4]);
    expect(a.bins.map((f) => f.x)).toEqual([1, 0, 0, 0, 2, 0, 0, 0]);
    expect(a.bins[4].rate).toBe(0.5);
    expect(a.bins[0].rate).toBe(0.25);
    expect(b.bins.map((f) => f.x)).toEqual([0, 0, 0, 0, 0, 1, 0, 0]);
    expect(b.bins[5]).toMatchObject({ n: 3, x: 1 });
    expect(b.bins[5].rate).toBeCloseTo(1 / 3, 12);
    // Afternoon 12–18: all 4 days counted (day 1 has 5 of 6 scans); A had storms on days 0, 1, 3.
    expect(a.afternoon).toMatchObject({ n: 4, x: 3, rate: 0.75 });
    expect(b.afternoon).toMatchObject({ n: 4, x: 1, rate: 0.25 });
    // Per area: A's 4 afternoon onsets over 4 days on 200 km² = 0.5 per 100 km² a day; bin 12–15 has 3.
    expect(a.afternoon.per100Km2).toBeCloseTo(4 / 4 / 2, 12);
    expect(a.bins[4].per100Km2).toBeCloseTo(3 / 4 / 2, 12);
    // The block under half covered is "no data", never zero.
    expect(c.hasData).toBe(false);
    expect(c.bins.every((f) => f.n === null && f.x === null && f.rate === null)).toBe(true);
    expect(c.afternoon.rate).toBeNull();
    expect(c.peakBin).toBeNull();
  });

  it('tells, day by day, which covered blocks saw an afternoon storm start (for the scorecard)', () => {
    const daily = computeOutlook({ ...input(days), withDaily: true }).afternoonDaily;
    // By hand from the events above: A on days 0, 1 and 3; B on day 2; C is not covered enough.
    expect(Array.from(daily?.counted ?? [])).toEqual([1, 1, 1, 1]);
    expect(Array.from(daily?.storm ?? [])).toEqual([1, 1, 0, 1, 0, 0, 1, 0, 0, 0, 0, 0]);
    expect(daily?.blockCounted).toEqual([true, true, false]);
    expect(computeOutlook(input(days)).afternoonDaily).toBeUndefined();
  });

  it('gives the afternoon rates alone exactly as the full count does (the climatology beside a regime)', () => {
    // By hand: A 3 of 4, B 1 of 4, C no data; on days 0 and 2 only, A 1 of 2 and B 1 of 2.
    expect(afternoonRates(input(days))).toEqual([0.75, 0.25, null]);
    expect(afternoonRates(input([d0, d0 + 2]))).toEqual([0.5, 0.5, null]);
  });

  it('gives the Jeffreys interval of x of n beside every rate', () => {
    const { blocks } = computeOutlook(input(days));
    const f = blocks[0].bins[4];
    expect({ lower: f.lower, upper: f.upper }).toEqual(jeffreysInterval(2, 4, 0.9));
    expect(blocks[0].bins[1].lower).toBe(0);
  });

  it('counts only the days asked about (a regime’s days)', () => {
    const { blocks } = computeOutlook(input([d0, d0 + 2]));
    expect(blocks[0].bins[4]).toMatchObject({ n: 2, x: 1, rate: 0.5 });
    expect(blocks[0].bins[0]).toMatchObject({ n: 2, x: 1 });
    expect(blocks[1].bins[5]).toMatchObject({ n: 2, x: 1 });
  });

  it('picks the bin with the highest shrunk estimate as the peak', () => {
    const { blocks, priors } = computeOutlook(input(days));
    expect(blocks[0].peakBin).toBe(4);
    expect(priors.bins[4].mean).toBeCloseTo(2 / 8, 12);
  });
});

describe('local time', () => {
  it('puts an onset one minute before local midnight in the last bin of that day, and one at midnight in the next day', () => {
    // A site at UTC+05:45 (345 min): local midnight of 2 June is 18:15 UTC on 1 June.
    const offset = 345;
    const d0 = dayOfDate('2025-06-01');
    const before = Date.parse('2025-06-01T18:14:00Z');
    const atMidnight = Date.parse('2025-06-01T18:15:00Z');
    expect([localDay(before, offset), localHour(before, offset)]).toEqual([d0, 23]);
    expect([localDay(atMidnight, offset), localHour(atMidnight, offset)]).toEqual([d0 + 1, 0]);
    const result = computeOutlook({
      blocks: [{ coverage: 1, countingAreaKm2: 100 }],
      eventTimes: Float64Array.from([before, atMidnight]),
      eventBlocks: ownBlock(Int32Array.from([0, 0])),
      scanHours: hourlyScans([d0, d0 + 1], offset),
      days: Int32Array.from([d0, d0 + 1]),
      utcOffsetMinutes: offset,
      intervalMin: 60,
      binHours: 1,
      afternoon: { fromHour: 12, toHour: 18 },
      minAvailability: 0.8,
      minBlockCoverage: 0.5,
      interval: 'wilson',
      level: 0.9,
    });
    const bins = result.blocks[0].bins;
    expect(bins).toHaveLength(24);
    expect(bins[23]).toMatchObject({ n: 2, x: 1 });
    expect(bins[0]).toMatchObject({ n: 2, x: 1 });
    expect(bins.slice(1, 23).every((f) => f.x === 0 && f.n === 2)).toBe(true);
  });

  it('counts a scan hour by the site’s local clock, so a +05:45 site’s hours start at :15 UTC', () => {
    // Scans at 06:14 and 06:16 UTC fall in local hours 11 and 12 of the same day.
    expect(localHour(Date.parse('2025-06-01T06:14:00Z'), 345)).toBe(11);
    expect(localHour(Date.parse('2025-06-01T06:16:00Z'), 345)).toBe(12);
    expect(localHour(Date.parse('2025-06-01T23:00:00Z'), -300)).toBe(18);
  });
});

describe('afternoon rates alone', () => {
  it('equal the full count’s afternoon rates on random records (a neighbourhood, outages, odd offsets)', () => {
    let seed = 11;
    const random = () => {
      seed = (seed * 1103515245 + 12345) % 2 ** 31;
      return seed / 2 ** 31;
    };
    for (let trial = 0; trial < 25; trial++) {
      const offset = [330, 345, -300, 0, 360][trial % 5];
      const d0 = dayOfDate('2025-06-01');
      const dayList = Array.from({ length: 20 + Math.floor(random() * 40) }, (_, i) => d0 + i);
      const outages: [number, number][] = dayList.flatMap((d) =>
        Array.from({ length: 24 }, (_, h) => [d, h] as [number, number]).filter(() => random() < 0.08),
      );
      const blocks = Array.from({ length: 6 }, () => ({ coverage: random(), countingAreaKm2: 100 }));
      const events = 300;
      const eventTimes = Float64Array.from({ length: events }, () =>
        at(d0 - 1 + Math.floor(random() * (dayList.length + 2)), offset, Math.floor(random() * 24), 7),
      );
      // Each event counts for zero to three blocks, as a neighbourhood radius gives.
      const offsets = new Int32Array(events + 1);
      const members: number[] = [];
      for (let e = 0; e < events; e++) {
        const k = Math.floor(random() * 4);
        for (let j = 0; j < k; j++) members.push(Math.floor(random() * blocks.length));
        offsets[e + 1] = members.length;
      }
      const selected = dayList.filter(() => random() < 0.6);
      const input: OutlookInput = {
        blocks,
        eventTimes,
        eventBlocks: { offsets, blockIndex: Int32Array.from(members) },
        scanHours: hourlyScans(dayList, offset, outages),
        days: Int32Array.from(selected),
        utcOffsetMinutes: offset,
        intervalMin: 60,
        binHours: 3,
        afternoon: { fromHour: 11 + (trial % 3), toHour: 17 + (trial % 2) },
        minAvailability: 0.8,
        minBlockCoverage: 0.5,
        interval: 'jeffreys',
        level: 0.9,
      };
      const full = computeOutlook(input).blocks.map((b) => b.afternoon.rate);
      expect(afternoonRates(input), `trial ${trial}`).toEqual(full);
      expect(
        full.some((r) => r !== null && r > 0),
        `trial ${trial} counts something`,
      ).toBe(true);
    }
  });
});
