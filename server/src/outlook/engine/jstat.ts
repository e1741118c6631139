import { createRequire } from 'node:module';

/** The two functions of jstat (a general-purpose statistics library) the outlook uses; it ships no types. */
interface JStat {
  beta: { inv(p: number, a: number, b: number): number };
  normal: { inv(p: number, mean: number, sd: number): number };
}

const require = createRequire(import.meta.url);
export const jStat = (require('jstat') as { jStat: JStat }).jStat;
