import { dirname, isAbsolute, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_SEED, RUN_DEFAULTS, SEASON_DAYS } from './config.js';
import { generateScenario } from './scenario.js';
import { writeScenario } from './write.js';

const HELP = `Vessary scenario generator

  npm run sample-data -- [--seed N] [--days D] [--out DIR] [--volumes N|all] [--run-date YYYY-MM-DD]

  --seed N        seed of every random stream (default ${DEFAULT_SEED})
  --days D        season length in days from 1 June (default ${SEASON_DAYS}: to 30 September)
  --out DIR       output directory (default sample-data/vessary). A relative path is taken from the
                  directory npm was started in (the repository root for "npm run sample-data").
  --volumes N     3-D radar volumes to write for the run's stormiest consecutive scans
                  (default ${RUN_DEFAULTS.committedVolumes}; "all" for every scan of the run)
  --run-date D    local date of the rendered radar run (default: the stormiest fully observed afternoon)
  --keep          do not empty the output directory first
  --quiet         print nothing but errors
`;

function parseArgs(argv: string[]) {
  const opts: {
    seed?: number;
    days?: number;
    out?: string;
    volumes?: number | 'all';
    runDate?: string;
    keep: boolean;
    quiet: boolean;
  } = { keep: false, quiet: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const value = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value`);
      return v;
    };
    const int = (v: string) => {
      if (!/^-?\d+$/.test(v)) throw new Error(`${a}: "${v}" is not an integer`);
      return Number(v);
    };
    if (a === '--seed') opts.seed = int(value());
    else if (a === '--days') opts.days = int(value());
    else if (a === '--out') opts.out = value();
    else if (a === '--volumes') {
      const v = value();
      opts.volumes = v === 'all' ? 'all' : int(v);
    } else if (a === '--run-date') opts.runDate = value();
    else if (a === '--keep') opts.keep = true;
    else if (a === '--quiet') opts.quiet = true;
    else if (a === '--help' || a === '-h') {
      process.stdout.write(HELP);
      process.exit(0);
    } else throw new Error(`unknown argument ${a} (see --help)`);
  }
  return opts;
}

function main() {
  const opts = parseArgs(process.argv.slice(2));
  const packageDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
  const base = process.env.INIT_CWD ?? process.cwd();
  const out = opts.out
    ? isAbsolute(opts.out)
      ? opts.out
      : resolve(base, opts.out)
    : join(packageDir, 'vessary');
  const t0 = performance.now();
  const sc = generateScenario({ seed: opts.seed, days: opts.days, runDate: opts.runDate });
  const { files, statistics: st } = writeScenario(sc, out, { volumes: opts.volumes, clean: !opts.keep });
  if (opts.quiet) return;
  const total = files.reduce((s, f) => s + f.bytes, 0);
  const log = (s: string) => process.stdout.write(`${s}\n`);
  log(`seed ${sc.seed}, ${sc.days} days (${sc.clock.dates[0]} – ${sc.clock.dates[sc.days - 1]}) → ${out}`);
  log(
    `${files.length} files, ${(total / 1048576).toFixed(2)} MiB, ${((performance.now() - t0) / 1000).toFixed(1)} s`,
  );
  log(
    `${st.cellRows} cell rows, ${st.storms} storms, ${st.onsets} onsets (peak ${st.peakLocalHour}:00 local), ` +
      `mean area ${st.cellAreaKm2.mean} km², mean duration ${st.stormDurationMin.mean} min, mean speed ${st.stormSpeedMS.mean} m/s`,
  );
  log(
    `onsets per 1000 km²: hills ${st.onsetDensityPer1000Km2.hills}, valley ${st.onsetDensityPer1000Km2.valley}; ` +
      `onsets/day dry ${st.onsetsPerDay.dryTercile}, moist ${st.onsetsPerDay.moistTercile}; ` +
      `scans ${st.scans.present}/${st.scans.nominal}; radar run ${sc.run.localDate}`,
  );
}

try {
  main();
} catch (e) {
  process.stderr.write(`sample-data: ${(e as Error).message}\n`);
  process.exit(1);
}
