import {
  blue60,
  cyan70,
  green60,
  magenta60,
  orange60,
  purple60,
  red60,
  teal50,
  yellow40,
} from '@carbon/colors';

/** Our own order of Carbon palette hues, chosen so neighbouring districts stay apart. */
export const GROUP_PALETTE = [
  blue60,
  teal50,
  magenta60,
  yellow40,
  purple60,
  green60,
  orange60,
  cyan70,
  red60,
] as const;

/** One colour per group key, stable for a given set of keys whatever order they arrive in. */
export function coloursForGroups(keys: Iterable<string>): Map<string, string> {
  const sorted = [...new Set(keys)].sort((a, b) => a.localeCompare(b));
  return new Map(sorted.map((key, index) => [key, GROUP_PALETTE[index % GROUP_PALETTE.length]]));
}
