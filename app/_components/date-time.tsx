import { formatInTimeZone } from "date-fns-tz";

/** A moment shown in a named zone, with the zone spelled out. */
export function DateTime({ value, zone = "UTC" }: { value: Date | string; zone?: string }) {
  const date = new Date(value);
  return (
    <time dateTime={date.toISOString()} className="tabular-nums">
      {formatInTimeZone(date, zone, "d MMM yyyy, HH:mm")} <span className="text-ink-muted">{zone}</span>
    </time>
  );
}
