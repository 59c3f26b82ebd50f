/**
 * Calendar date and time of day <-> seconds since 1970-01-01 00:00 (UTC, proleptic Gregorian), without
 * a clock or the Date object, so the core stays deterministic. Days-from-civil by the usual era
 * arithmetic (400-year cycles of 146097 days; common practice).
 */
export interface CivilTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
  /** Fraction of a second in [0, 1). */
  subsecond?: number;
}

/** Days since 1970-01-01 of a proleptic Gregorian date. */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/** The date of a day count since 1970-01-01. */
export function civilFromDays(days: number): { year: number; month: number; day: number } {
  const z = days + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

export function epochFromCivil(t: CivilTime): number {
  return daysFromCivil(t.year, t.month, t.day) * 86400 + t.hour * 3600 + t.minute * 60 + t.second + (t.subsecond ?? 0);
}

export function civilFromEpoch(seconds: number): CivilTime {
  const whole = Math.floor(seconds);
  const days = Math.floor(whole / 86400);
  const rest = whole - days * 86400;
  return {
    ...civilFromDays(days),
    hour: Math.floor(rest / 3600),
    minute: Math.floor((rest % 3600) / 60),
    second: rest % 60,
    subsecond: seconds - whole,
  };
}

export function daysInMonth(year: number, month: number): number {
  return daysFromCivil(month === 12 ? year + 1 : year, month === 12 ? 1 : month + 1, 1) - daysFromCivil(year, month, 1);
}

/** "2026-03-02T07:58:00.250Z" (milliseconds shown only when not whole). */
export function isoFromEpoch(seconds: number): string {
  const c = civilFromEpoch(seconds);
  const p = (n: number, w = 2) => String(n).padStart(w, '0');
  const ms = Math.round((c.subsecond ?? 0) * 1e6);
  const frac = ms === 0 ? '' : `.${p(ms, 6).replace(/0+$/, '')}`;
  return `${p(c.year, 4)}-${p(c.month)}-${p(c.day)}T${p(c.hour)}:${p(c.minute)}:${p(c.second)}${frac}Z`;
}
