const dateTime = new Intl.DateTimeFormat('en-GB', {
  year: 'numeric',
  month: 'short',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
});

/** Date and time for tables and mail headers: "01 Dec 2026, 17:32"; an en dash when absent. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '–';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTime.format(date);
}

const shortDate = new Intl.DateTimeFormat('en-GB', { day: '2-digit', month: 'short' });

/** Day and month only, for dense cells ("01 Dec"); the full date goes in the cell's title. */
export function formatShortDate(iso: string | null | undefined): string {
  if (!iso) return '–';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : shortDate.format(date);
}
