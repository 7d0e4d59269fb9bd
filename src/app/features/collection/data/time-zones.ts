/** Every IANA time zone this browser knows, with UTC first; falls back to a few if the API is missing. */
export function timeZones(): string[] {
  const intl = Intl as typeof Intl & { supportedValuesOf?: (key: 'timeZone') => string[] };
  const zones = intl.supportedValuesOf?.('timeZone') ?? ['Pacific/Fiji', 'Pacific/Auckland', 'Asia/Manila', 'Europe/London'];
  return ['UTC', ...zones.filter((zone) => zone !== 'UTC')];
}

/** Zones containing every word typed, ignoring case, spaces for underscores ("port mores" finds Pacific/Port_Moresby). */
export function matchTimeZones(zones: readonly string[], typed: string, limit = 50): string[] {
  const words = typed.trim().toLowerCase().replace(/_/g, ' ').split(/[\s/]+/).filter(Boolean);
  if (words.length === 0) return zones.slice(0, limit);
  return zones.filter((zone) => {
    const text = zone.toLowerCase().replace(/_/g, ' ');
    return words.every((word) => text.includes(word));
  }).slice(0, limit);
}

/** The zone's current offset from UTC in words ("UTC+12:00"), for the hint under the field. */
export function zoneOffset(zone: string, at = new Date()): string | null {
  try {
    const parts = new Intl.DateTimeFormat('en', { timeZone: zone, timeZoneName: 'longOffset' }).formatToParts(at);
    const name = parts.find((part) => part.type === 'timeZoneName')?.value ?? null;
    return name === 'GMT' ? 'UTC+00:00' : (name?.replace('GMT', 'UTC') ?? null);
  } catch {
    return null;
  }
}
