import { formatInTimeZone, fromZonedTime } from "date-fns-tz";

/** The zone a new tender's closing time starts in: the buying company's own. */
export const DEFAULT_ZONE = "Europe/London";

/** A local date and time as an HTML datetime-local field gives it. */
export const LOCAL_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/;
const LOCAL_FORMAT = "yyyy-MM-dd'T'HH:mm";

export function isValidZone(zone: string): boolean {
  if (!zone) return false;
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/** The zones a buyer may choose from, UTC first. */
export function zoneChoices(): string[] {
  const zones = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return ["UTC", ...zones.filter((z) => z !== "UTC")];
}

/** The UTC instant of a wall-clock date and time in a zone ("2027-03-28T10:00" in "Europe/Berlin"). */
export function closingInstant(local: string, zone: string): Date {
  return fromZonedTime(local, zone);
}

/** The wall-clock date and time of an instant in a zone, as a datetime-local field wants it. */
export function closingLocal(instant: Date, zone: string): string {
  return formatInTimeZone(instant, zone, LOCAL_FORMAT);
}

/**
 * False for a wall-clock time the zone skips when its clocks go forward (01:30 in London on
 * the last Sunday of March): such a closing time would silently move by an hour.
 */
export function localTimeExists(local: string, zone: string): boolean {
  if (!LOCAL_DATE_TIME.test(local) || !isValidZone(zone)) return false;
  const instant = closingInstant(local, zone);
  return !Number.isNaN(instant.getTime()) && closingLocal(instant, zone) === local;
}
