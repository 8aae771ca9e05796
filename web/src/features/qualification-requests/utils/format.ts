const day = new Intl.DateTimeFormat('en-GB', { year: 'numeric', month: 'short', day: '2-digit' });

/** A calendar date (YYYY-MM-DD) as "31 Mar 2027", read in the viewer's own calendar (noon, so no zone moves it a day). */
export function formatDay(date: string | null | undefined): string {
  if (!date) return '–';
  const d = new Date(`${date.slice(0, 10)}T12:00:00`);
  return Number.isNaN(d.getTime()) ? date : day.format(d);
}

/** Whole days since an instant: "today", "1 day ago", "12 days ago". */
export function age(iso: string, now = Date.now()): string {
  const days = Math.max(0, Math.floor((now - Date.parse(iso)) / 86_400_000));
  return days === 0 ? 'today' : days === 1 ? '1 day ago' : `${days} days ago`;
}
