// A date or time in an island: rendered on the server in the site's locale, then in the reader's own after hydration.
import { useEffect, useState } from 'react';
import { formatDate, formatDateTime, formatLongDate, formatTime, SITE_LOCALE, type DateInput } from '@/lib/format';

const FORMATS = { date: formatDate, long: formatLongDate, dateTime: formatDateTime, time: formatTime } as const;

export function When({ value, as = 'date', className }: { value: DateInput; as?: keyof typeof FORMATS; className?: string }) {
  const format = FORMATS[as];
  const [text, setText] = useState(() => format(value, SITE_LOCALE));
  useEffect(() => setText(format(value)), [format, value]);
  const iso = new Date(value).toISOString();
  return <time dateTime={iso} className={className} suppressHydrationWarning>{text}</time>;
}
