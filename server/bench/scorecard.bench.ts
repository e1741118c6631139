/**
 * npm run bench:scorecard — a district's season scorecard on the ten generated seasons of
 * bench:outlook: 50 blocks, 18 weekly bulletins sent through the last season, field reports on some
 * block-weeks, radar outcomes counted from 50 000 onset tracks, and 1 000 bootstrap resamples of days.
 * Prints the time cold (radar columns loaded) and warm, and through HTTP; the last line is
 * `scorecard-ms: X` (cold, goal < 2000).
 */
import type { BulletinContent, BulletinOutlookInputs } from '@stormhour/shared';
import {
  app,
  base,
  blockAt,
  call,
  DAY,
  districtIds,
  FIRST_YEAR,
  ms,
  percentile,
  pg,
  rand,
  SEASONS,
  siteId,
  token,
} from './generated-seasons.js';

const dist = (path: string) => new URL(`../dist/${path}`, import.meta.url).href;
const { ScorecardService } = (await import(
  dist('scorecard/scorecard.service.js')
)) as typeof import('../src/scorecard/scorecard.service.js');

const year = FIRST_YEAR + SEASONS - 1;
const districtId = districtIds[0];
const blocks = (
  await pg.query<{ id: number; code: string; name: string }>(
    'select id, code, name from blocks where district_id = $1 order by id',
    [districtId],
  )
).rows;
const userId = (await pg.query<{ id: number }>('select id from users order by id limit 1')).rows[0].id;
const officerId = (
  await pg.query<{ id: number }>(
    `insert into users (email, name, role, district_id, password_hash)
     values ('officer@unit.example', 'Benchmark officer', 'officer', $1, 'x') returning id`,
    [districtId],
  )
).rows[0].id;

// Weekly bulletins from the first Monday of June to the last full week of September.
const date = (t: number) => new Date(t).toISOString().slice(0, 10);
let monday = Date.UTC(year, 5, 1);
while (new Date(monday).getUTCDay() !== 1) monday += DAY;
let sent = 0;
let reports = 0;
const inputs: BulletinOutlookInputs = {
  siteId,
  siteCode: 'BENCH',
  regime: 'all',
  regimeChosenBy: 'request',
  binHours: 3,
  afternoonFrom: 12,
  afternoonTo: 18,
  fingerprint: 'bench',
  proposedBy: [],
};
for (; monday + 6 * DAY <= Date.UTC(year, 8, 30); monday += 7 * DAY) {
  const content: BulletinContent = {
    unitName: 'Benchmark unit',
    districtCode: 'D0',
    districtName: 'District 0',
    number: `D0-${year}-${sent + 23}`,
    issueDate: date(monday - DAY),
    weekStart: date(monday),
    weekEnd: date(monday + 6 * DAY),
    afternoonFromHour: 12,
    afternoonToHour: 18,
    regimeLabel: null,
    summary: '',
    outlook: blocks.map((b) => {
      const chance = Math.round((0.05 + 0.6 * rand()) * 100) / 100;
      return {
        blockCode: b.code,
        blockName: b.name,
        afternoonChance: chance,
        lower: null,
        upper: null,
        n: 100,
        peakHourLocal: 15,
        climatologyChance: 0.3,
        inWords: '',
      };
    }),
    crops: [],
    generalAdvice: '',
    cautions: [],
  };
  const id = (
    await pg.query<{ id: number }>(
      `insert into bulletins (district_id, week_start, number, state, author_id, current_version, approved_version,
         utc_offset_minutes, drafted_from, approved_from, approved_at, sent_at)
       values ($1, $2, $3, 'sent', $4, 1, 1, 360, $5, $5, now(), now()) returning id`,
      [districtId, content.weekStart, content.number, userId, JSON.stringify(inputs)],
    )
  ).rows[0].id;
  await pg.query(
    'insert into bulletin_versions (bulletin_id, version, content, saved_by) values ($1, 1, $2, $3)',
    [id, JSON.stringify(content), userId],
  );
  // An officer reports on a tenth of the blocks each week.
  for (const b of blocks.filter(() => rand() < 0.1)) {
    const seen = rand() < 0.4;
    const day = Math.floor(rand() * 7);
    await pg.query(
      `insert into field_reports (bulletin_id, block_id, officer_id, storm_seen, start_local, hail, wind_damage,
         crop_damage, action_taken, usefulness, notes, at)
       values ($1, $2, $3, $4, $5, false, false, false, '', 4, '', $6)`,
      [
        id,
        b.id,
        officerId,
        seen,
        seen
          ? `${date(monday + day * DAY)}T${String(12 + Math.floor(rand() * 6)).padStart(2, '0')}:10`
          : null,
        new Date(monday + 7 * DAY).toISOString(),
      ],
    );
    reports++;
  }
  sent++;
}
console.log(
  `district of ${blocks.length} blocks (of ${blockAt.length}): ${sent} sent bulletins in ${year}, ${reports} field reports`,
);

const service = app.get(ScorecardService);
const query = {
  districtId,
  from: `${year}-06-01`,
  to: `${year}-09-30`,
  source: 'combined' as const,
  resamples: 1000,
};
let t0 = performance.now();
const cold = await service.scorecard(query);
const coldMs = performance.now() - t0;
const v = cold.view;
console.log(
  `scorecard, cold (radar columns of 10 seasons loaded, ${v.pairs} block-days paired, 1 000 resamples): ${ms(coldMs)}`,
);
console.log(
  `  Brier ${v.brier?.toFixed(3)} (${v.brierInterval?.lower.toFixed(3)}–${v.brierInterval?.upper.toFixed(3)}), skill ${v.skill?.toFixed(3)}, ROC area ${v.roc.area?.toFixed(3)}, agreement ${JSON.stringify(v.agreement)}`,
);
const warm: number[] = [];
for (let i = 0; i < 5; i++) {
  t0 = performance.now();
  await service.scorecard(query);
  warm.push(performance.now() - t0);
}
console.log(
  `scorecard, warm (columns cached; pairing and bootstrap again): median ${ms(percentile(warm, 50))}`,
);
t0 = performance.now();
await service.scorecard({ ...query, resamples: 0 });
console.log(`  of which without the bootstrap: ${ms(performance.now() - t0)}`);
t0 = performance.now();
await call(
  'GET',
  `/api/scorecard?districtId=${districtId}&from=${query.from}&to=${query.to}&source=combined`,
  undefined,
  token,
);
console.log(`GET /api/scorecard on ${base}: ${ms(performance.now() - t0)}`);
await app.close();
console.log(`scorecard-ms: ${coldMs.toFixed(0)}`);
process.exit(0);
