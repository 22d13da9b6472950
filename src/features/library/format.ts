import { LOCALE } from '../../../shared/words';

const dateFormat = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium' });
const dateTimeFormat = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium', timeStyle: 'short' });

/** A day written the British way (5 Dec 2026); an unreadable date is shown as given rather than "Invalid Date". */
export function formatDate(iso: string, withTime = false): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return (withTime ? dateTimeFormat : dateFormat).format(date);
}
