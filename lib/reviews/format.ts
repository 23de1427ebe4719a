// Dates in e-mails are read far from the server's clock: spelled out, in UTC, with the zone named.
const WHEN = new Intl.DateTimeFormat("en-GB", {
  weekday: "short",
  day: "numeric",
  month: "long",
  year: "numeric",
  hour: "2-digit",
  minute: "2-digit",
  timeZone: "UTC",
});

export function formatWhen(date: Date): string {
  return `${WHEN.format(date)} UTC`;
}
