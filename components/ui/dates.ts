const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
const timeFormat = new Intl.DateTimeFormat("en-GB", {
  day: "numeric",
  month: "short",
  hour: "2-digit",
  minute: "2-digit",
  timeZone: "UTC",
  timeZoneName: "short",
});

/** "2026-01-12" → "12 Jan 2026". Calendar dates carry no zone, so they are read and shown as UTC. */
export function formatDay(isoDate: string): string {
  return dayFormat.format(new Date(`${isoDate}T00:00:00Z`));
}

export function formatDayRange(startsOn: string, endsOn: string): string {
  return `${formatDay(startsOn)} – ${formatDay(endsOn)}`;
}

export function formatMoment(date: Date): string {
  return timeFormat.format(date);
}
