// The date a JCAMP-DX file says its spectrum was measured on, as an ISO 8601 calendar date.

/** A real calendar date as YYYY-MM-DD, or null (2024-02-30 is not one). */
export function calendarDate(year: number, month: number, day: number): string | null {
  const date = new Date(Date.UTC(year, month - 1, day));
  if (date.getUTCFullYear() !== year || date.getUTCMonth() !== month - 1 || date.getUTCDate() !== day) return null;
  return `${String(year).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
}

/**
 * ##LONG DATE (JCAMP-DX 5: YYYY/MM/DD, a time may follow) is read first; then ##DATE, which
 * JCAMP-DX 4.24 writes YY/MM/DD. A two-digit year is taken as 19YY from 70 up, else 20YY (the
 * POSIX strptime %y convention; common practice, no source), and the note says so. Any other
 * form (day first, month names) is ambiguous: it is left unread and the note asks for the date.
 */
export function jcampMeasuredOn(longDate: string | undefined, shortDate: string | undefined): { date: string | null; note: string | null } {
  const full = longDate === undefined ? null : /^\s*(\d{4})[/-](\d{1,2})[/-](\d{1,2})(?:\D|$)/.exec(longDate);
  if (full) {
    const date = calendarDate(Number(full[1]), Number(full[2]), Number(full[3]));
    if (date) return { date, note: `Measured on ${date}, from the file's ##LONG DATE.` };
  }
  const written = shortDate ?? longDate;
  if (written === undefined) return { date: null, note: null };
  const four = /^\s*(\d{4})[/-](\d{1,2})[/-](\d{1,2})\s*$/.exec(written);
  if (four) {
    const date = calendarDate(Number(four[1]), Number(four[2]), Number(four[3]));
    if (date) return { date, note: `Measured on ${date}, from the file's ##DATE.` };
  }
  const two = /^\s*(\d{2})\/(\d{1,2})\/(\d{1,2})\s*$/.exec(written);
  if (two) {
    const yy = Number(two[1]);
    const date = calendarDate(yy >= 70 ? 1900 + yy : 2000 + yy, Number(two[2]), Number(two[3]));
    if (date) return { date, note: `Measured on ${date}, from the file's ##DATE=${written.trim()} (YY/MM/DD; a year below 70 taken as 20YY).` };
  }
  return {
    date: null,
    note: `The file's date "${written.trim()}" is not YYYY/MM/DD or YY/MM/DD, so it was not read as the date of measurement; give --measured-on.`,
  };
}
