import { OutlookQuery, type ScorecardPair } from '@stormhour/shared';
import Papa from 'papaparse';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutlookService } from '../outlook/outlook.service.js';
import { dateOfDay, dayOfDate } from '../radar/engine/local-time.js';
import { type Auth, loadDemoSeason } from '../testing/demo-season.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';
import { type IssuedChance, pairChances, type RadarAfternoon } from './engine/pairing.js';
import { scorePairs } from './engine/scorecard.js';

const WEEK = '2025-08-04';
const WEEK_END = '2025-08-10';

describe('the scorecard of sent bulletins', () => {
  let t: TestApp;
  let siteId: number;
  let scientist: Auth;
  let writer: Auth;
  let officer: Auth;
  let districtId: number;
  let bulletin: { id: number; content: { outlook: { blockCode: string; afternoonChance: number | null }[] } };

  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 20 * 1024 * 1024 });
    ({ siteId, scientist } = await loadDemoSeason(t));
    const districts = (await t.http.get('/api/districts').set(scientist)).body as {
      id: number;
      code: string;
    }[];
    districtId = (districts.find((d) => d.code === 'HLF') as { id: number }).id;
    writer = { Authorization: `Bearer ${await t.signedIn('writer')}` };
    officer = { Authorization: `Bearer ${await t.signedIn('officer', { districtId })}` };
    const created = await t.http
      .post('/api/bulletins')
      .set(writer)
      .send({ districtId, weekStart: WEEK, regime: 'all' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.id;
    await t.http.post(`/api/bulletins/${id}/submit`).set(writer).send({}).expect(201);
    await t.http.post(`/api/bulletins/${id}/approve`).set(scientist).send({}).expect(201);
    await t.http.post(`/api/bulletins/${id}/send`).set(writer).send({}).expect(201);
    bulletin = (await t.http.get(`/api/bulletins/${id}`).set(writer).expect(200)).body;
  }, 600_000);
  afterAll(() => t.close());

  const query = (source: string, extra = '') =>
    `/api/scorecard?districtId=${districtId}&from=${WEEK}&to=${WEEK_END}&source=${source}&resamples=200${extra}`;

  it('pairs every block-day of the sent week with radar, as the outlook of that week counts it', async () => {
    const card = (await t.http.get(query('radar')).set(scientist).expect(200)).body;
    expect(card).toMatchObject({ districtName: expect.any(String), bulletins: 1, source: 'radar' });
    const csv = await t.http
      .get(query('radar').replace('/api/scorecard?', '/api/scorecard.csv?'))
      .set(scientist)
      .expect(200);
    const rows = Papa.parse<Record<string, string>>(csv.text, { header: true, skipEmptyLines: true }).data;
    expect(rows).toHaveLength(card.pairs);
    // The outlook of the same seven days (all days, the block itself): n days counted and x with a storm.
    const week = (
      await t.http.get(`/api/outlook?siteId=${siteId}&from=${WEEK}&to=${WEEK_END}`).set(scientist).expect(200)
    ).body as { blocks: { code: string; afternoon: { n: number | null; x: number | null } }[] };
    const issued = bulletin.content.outlook.filter((b) => b.afternoonChance !== null);
    expect(issued.length).toBeGreaterThan(0);
    for (const b of issued) {
      const mine = rows.filter((r) => r.block_code === b.blockCode);
      const counted = week.blocks.find((w) => w.code === b.blockCode)?.afternoon;
      expect(mine.length, b.blockCode).toBe(counted?.n ?? 0);
      expect(mine.filter((r) => r.observed === '1').length, b.blockCode).toBe(counted?.x ?? 0);
      // The chance scored is the one the bulletin sent.
      for (const r of mine) expect(Number(r.chance)).toBe(b.afternoonChance);
    }
    // Brier score recomputed from the CSV by its definition (Brier 1950): the mean squared difference.
    const bs = rows.reduce((s, r) => s + (Number(r.chance) - Number(r.observed)) ** 2, 0) / rows.length;
    expect(card.brier).toBeCloseTo(bs, 12);
    expect(card.brierInterval.lower).toBeLessThanOrEqual(card.brier);
  });

  it('takes an officer’s field report as the outcome of its block and day, and compares it with radar', async () => {
    const blockCode = bulletin.content.outlook.find((b) => b.afternoonChance !== null)?.blockCode as string;
    await t.http
      .post(`/api/inbox/${bulletin.id}/reports`)
      .set(officer)
      .send({ blockCode, stormSeen: true, startTime: '2025-08-05T14:30', usefulness: 4 })
      .expect(201);
    const reports = (await t.http.get(query('reports')).set(scientist).expect(200)).body;
    expect(reports.pairs).toBe(1);
    expect(reports.events).toBe(1);
    const combined = (await t.http.get(query('combined')).set(scientist).expect(200)).body;
    const radar = (await t.http.get(query('radar')).set(scientist).expect(200)).body;
    // Radar has that day, so it decides; the report only enters the agreement table.
    expect(combined.pairs).toBe(radar.pairs);
    const a = combined.agreement;
    expect(a.both + a.radarOnly + a.reportOnly + a.neither).toBe(1);
    expect(a.both + a.reportOnly).toBe(1);
  });

  it('writes the report as a PDF naming the district', async () => {
    const res = await t.http
      .get(query('radar').replace('/api/scorecard?', '/api/scorecard.pdf?'))
      .set(scientist)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const doc = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false }).promise;
    const page = await doc.getPage(1);
    const text = (await page.getTextContent()).items.map((i) => ('str' in i ? i.str : '')).join(' ');
    const card = (await t.http.get(query('radar')).set(scientist)).body;
    expect(text).toContain(card.districtName);
    expect(text).toContain('Brier score');
  });

  it('refuses a reversed period, an unknown district and an officer, saying what is wrong', async () => {
    const reversed = await t.http
      .get(`/api/scorecard?districtId=${districtId}&from=${WEEK_END}&to=${WEEK}`)
      .set(scientist)
      .expect(400);
    expect(reversed.body.details[0]).toMatchObject({ where: 'to' });
    const unknown = await t.http
      .get(`/api/scorecard?districtId=9999&from=${WEEK}&to=${WEEK_END}`)
      .set(scientist)
      .expect(400);
    expect(unknown.body.message).toMatch(/no district with id 9999/);
    await t.http.get(query('radar')).set(officer).expect(403);
  });

  it('shows skill when the first half’s regime chances are issued for the second half, and none when regimes are shuffled', async () => {
    // The check on the demo scenario: the generator makes moist days stormier, so chances
    // conditioned on each week's regime (learnt from June–July) should beat the all-days chance in
    // August–September, and lose that edge when the weeks' regimes are shuffled.
    const outlook = t.app.get(OutlookService);
    const learn = { from: '2025-06-01', to: '2025-07-31' };
    const regimes = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(scientist).expect(200)).body as {
      days: { date: string; regime: string | null }[];
    };
    const regimeOf = new Map(regimes.days.map((d) => [d.date, d.regime]));
    const mondays: string[] = [];
    for (let d = dayOfDate('2025-08-04'); d <= dayOfDate('2025-09-22'); d += 7) mondays.push(dateOfDay(d));
    const daysOf = (monday: string) => Array.from({ length: 7 }, (_, k) => dateOfDay(dayOfDate(monday) + k));
    const majority = (monday: string) => {
      const counts = new Map<string, number>();
      for (const date of daysOf(monday)) {
        const r = regimeOf.get(date);
        if (r) counts.set(r, (counts.get(r) ?? 0) + 1);
      }
      return [...counts].sort((a, b) => b[1] - a[1])[0]?.[0] ?? 'all';
    };
    // The forecast scored: each block's all-days chance in June–July, scaled by how much stormier the
    // regime's days were than all days over the whole district (x and n summed over its blocks). Two
    // months give each regime only a few days per block, too few for per-block regime rates.
    const learnt = async (regime: string) => {
      const body = (await outlook.outlook(OutlookQuery.parse({ siteId, regime, ...learn }))).body;
      const mine = body.blocks.filter((b) => b.afternoon.n);
      const x = mine.reduce((s, b) => s + (b.afternoon.x ?? 0), 0);
      const n = mine.reduce((s, b) => s + (b.afternoon.n ?? 0), 0);
      return { rate: x / n, blocks: new Map(mine.map((b) => [b.code, b.afternoon.rate as number])) };
    };
    const all = await learnt('all');
    const ratioCache = new Map<string, number>();
    const chancesFor = async (regime: string) => {
      if (!ratioCache.has(regime)) {
        let ratio = 1;
        if (regime !== 'all')
          try {
            ratio = (await learnt(regime)).rate / all.rate;
          } catch {
            ratio = 1; // a regime June–July never saw: no information beyond the all-days chance
          }
        ratioCache.set(regime, ratio);
      }
      const ratio = ratioCache.get(regime) as number;
      return new Map([...all.blocks].map(([code, p]) => [code, Math.min(0.95, p * ratio)]));
    };
    const daily = await outlook.afternoonDaily({
      ...OutlookQuery.parse({ siteId }),
      from: '2025-08-04',
      to: '2025-09-28',
    });
    const radar: RadarAfternoon[] = [];
    daily.blocks.forEach((b, i) => {
      if (!daily.daily.blockCounted[i]) return;
      daily.dates.forEach((date, p) => {
        if (daily.daily.counted[p])
          radar.push({
            blockCode: b.code,
            date,
            stormStarted: daily.daily.storm[i * daily.dates.length + p] === 1,
          });
      });
    });
    const score = async (regimeOfWeek: (monday: string, k: number) => string) => {
      const issued: IssuedChance[] = [];
      for (const [k, monday] of mondays.entries()) {
        const chances = await chancesFor(regimeOfWeek(monday, k));
        for (const [blockCode, chance] of chances) {
          if (chance === null) continue;
          issued.push({
            bulletinId: k + 1,
            bulletinNumber: `W${k + 1}`,
            blockCode,
            blockName: blockCode,
            dates: daysOf(monday),
            chance,
            climatologyChance: all.blocks.get(blockCode) ?? null,
          });
        }
      }
      const { pairs } = pairChances(issued, radar, [], { fromHour: 12, toHour: 18 }, 'radar');
      return scorePairs(pairs as ScorecardPair[], { resamples: 0, thresholds: [] });
    };
    const informative = await score((monday) => majority(monday));
    const dailyScore = async (regimeOfDate: (date: string, k: number) => string) => {
      const issued: IssuedChance[] = [];
      for (const [k, date] of mondays.flatMap(daysOf).entries()) {
        for (const [blockCode, chance] of await chancesFor(regimeOfDate(date, k)))
          issued.push({
            bulletinId: k + 1,
            bulletinNumber: date,
            blockCode,
            blockName: blockCode,
            dates: [date],
            chance,
            climatologyChance: all.blocks.get(blockCode) ?? null,
          });
      }
      const { pairs } = pairChances(issued, radar, [], { fromHour: 12, toHour: 18 }, 'radar');
      return scorePairs(pairs as ScorecardPair[], { resamples: 0, thresholds: [] });
    };
    const secondHalf = mondays.flatMap(daysOf).map((d) => regimeOf.get(d) ?? 'all');
    const dayInformative = await dailyScore((date) => regimeOf.get(date) ?? 'all');
    // Day k gets the regime of day (17k + 5) mod 56: a fixed permutation, as 17 and 56 share no factor.
    const dayShuffled = await dailyScore((_, k) => secondHalf[(k * 17 + 5) % secondHalf.length]);
    // A fixed derangement of the weeks' regimes: each week gets another week's regime.
    const weekly = mondays.map(majority);
    const shuffled = await score((_, k) => weekly[(k + 3) % weekly.length]);
    console.log(
      `demo scorecard, second half (${informative.pairs} block-days): skill with each day's regime ${dayInformative.skill?.toFixed(3)}, shuffled ${dayShuffled.skill?.toFixed(3)}; with each week's regime ${informative.skill?.toFixed(3)}, shuffled ${shuffled.skill?.toFixed(3)}`,
    );
    expect(informative.pairs).toBeGreaterThan(1000);
    // Known regimes carry the generator's signal: clear skill day by day, less (but some) when one
    // regime stands for a whole week.
    expect(dayInformative.skill as number).toBeGreaterThan(0.05);
    expect(informative.skill as number).toBeGreaterThan(0);
    // Shuffled regimes carry none: a confidently wrong chance scores below the usual chance.
    expect(dayShuffled.skill as number).toBeLessThan(0);
    expect(shuffled.skill as number).toBeLessThan(0);
  });
});
