/** Time stamps of log entries. The clock lives here (and in the UI), never in src/core. */

function pad(n: number, w = 2): string {
  return String(Math.trunc(Math.abs(n))).padStart(w, "0");
}

/**
 * ISO 8601 in local time with the local offset, to the second: 2024-05-01T14:03:05+02:00.
 * @param d the instant
 * @param offsetMin minutes EAST of UTC (default: the device's, i.e. -getTimezoneOffset())
 */
export function isoLocal(d: Date, offsetMin = -d.getTimezoneOffset()): string {
  const t = new Date(d.getTime() + offsetMin * 60_000);
  const sign = offsetMin < 0 ? "-" : "+";
  const off = Math.abs(offsetMin);
  return (
    `${t.getUTCFullYear()}-${pad(t.getUTCMonth() + 1)}-${pad(t.getUTCDate())}` +
    `T${pad(t.getUTCHours())}:${pad(t.getUTCMinutes())}:${pad(t.getUTCSeconds())}` +
    `${sign}${pad(off / 60)}:${pad(off % 60)}`
  );
}

/** YYYYMMDD-HHMMSS of the local time in an ISO 8601 text (for file names). */
export function fileStamp(isoLocalText: string): string {
  const m = /^(\d{4})-(\d\d)-(\d\d)T(\d\d):(\d\d):(\d\d)/.exec(isoLocalText);
  if (!m) return "unknown-time";
  return `${m[1]}${m[2]}${m[3]}-${m[4]}${m[5]}${m[6]}`;
}

/** The day (YYYY-MM-DD) of the local time in an ISO 8601 text: what "filter by day" compares. */
export function localDay(isoLocalText: string): string {
  return isoLocalText.slice(0, 10);
}
