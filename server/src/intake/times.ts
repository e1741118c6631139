/** Parses the time formats cell tables and inventories use; times without an offset take `zone`. */

const ISO_WITH_ZONE = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})$/i;
const LOCAL = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.(\d+))?)?$/;

/** Minutes east of UTC for 'UTC' or '+06:00'. */
export function offsetMinutes(zone: string): number {
  if (zone === 'UTC') return 0;
  const m = /^([+-])(\d{2}):(\d{2})$/.exec(zone);
  if (!m) throw new Error(`Unknown time zone ${zone}: use UTC or an offset such as +06:00`);
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
}

/** Milliseconds since the epoch, or null if the text is not a time we read. */
export function parseTime(text: string, zone = 'UTC'): number | null {
  const s = text.trim();
  if (ISO_WITH_ZONE.test(s)) {
    const t = Date.parse(s.replace(' ', 'T').replace(/([+-]\d{2})(\d{2})$/, '$1:$2'));
    return Number.isNaN(t) ? null : t;
  }
  const m = LOCAL.exec(s);
  if (!m) return null;
  const [, y, mo, d, h, mi, sec, frac] = m;
  const month = Number(mo);
  const day = Number(d);
  if (
    month < 1 ||
    month > 12 ||
    day < 1 ||
    day > 31 ||
    Number(h) > 23 ||
    Number(mi) > 59 ||
    Number(sec ?? 0) > 59
  )
    return null;
  const utc = Date.UTC(
    Number(y),
    month - 1,
    day,
    Number(h),
    Number(mi),
    Number(sec ?? 0),
    Number(`0.${frac ?? 0}`) * 1000,
  );
  // Date.UTC rolls 31 April into May: refuse dates that do not exist.
  if (new Date(utc).getUTCDate() !== day) return null;
  return utc - offsetMinutes(zone) * 60_000;
}

/**
 * Reads a scan time from a file name with a pattern such as "VSR_YYYYMMDD_hhmm.tif" (tokens YYYY MM DD
 * hh mm ss; other characters must match exactly). Times are UTC. With `dateOnly`, a pattern with no
 * hh mm gives midnight UTC of its date.
 */
export function timeFromFileName(fileName: string, pattern: string, dateOnly = false): number | null {
  const tokens = ['YYYY', 'MM', 'DD', 'hh', 'mm', 'ss'];
  let regex = '';
  const order: string[] = [];
  for (let i = 0; i < pattern.length; ) {
    const token = tokens.find((t) => pattern.startsWith(t, i));
    if (token) {
      regex += `(\\d{${token.length}})`;
      order.push(token);
      i += token.length;
    } else {
      regex += pattern[i].replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
      i++;
    }
  }
  const m = new RegExp(`^${regex}$`).exec(fileName);
  if (!m) return null;
  const v = Object.fromEntries(order.map((t, k) => [t, m[k + 1]]));
  if (!v.YYYY || !v.MM || !v.DD) return null;
  // A daily file names its first day only: midnight UTC stands for the date.
  if (dateOnly && !v.hh) return parseTime(`${v.YYYY}-${v.MM}-${v.DD}T00:00:00`, 'UTC');
  if (!v.hh || !v.mm) return null;
  return parseTime(`${v.YYYY}-${v.MM}-${v.DD}T${v.hh}:${v.mm}:${v.ss ?? '00'}`, 'UTC');
}
