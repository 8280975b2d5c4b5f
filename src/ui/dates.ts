/** Today's calendar date on the phone, "YYYY-MM-DD" (local time: a day in the field is a local day). */
export function localDate(now = new Date()): string {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}`;
}
