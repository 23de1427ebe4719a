// Dates on order pages: one fixed zone (UTC, the zone the returns window is counted in) so what the
// server renders is what every reader sees, whatever their machine's zone.
const dateTime = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone: "UTC", timeZoneName: "short" });
const dateOnly = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

export function formatOrderDateTime(date: Date | string): string {
  return dateTime.format(new Date(date));
}

export function formatOrderDate(date: Date | string): string {
  return dateOnly.format(new Date(date));
}
