/**
 * Zones renamed in the IANA database whose old name some engines still list (their ICU data keeps
 * CLDR's canonical names). Old name to current name, from the tzdata "backward" file.
 */
const RENAMED: Record<string, string> = {
  'Africa/Asmera': 'Africa/Asmara',
  'America/Buenos_Aires': 'America/Argentina/Buenos_Aires',
  'America/Catamarca': 'America/Argentina/Catamarca',
  'America/Cordoba': 'America/Argentina/Cordoba',
  'America/Godthab': 'America/Nuuk',
  'America/Indianapolis': 'America/Indiana/Indianapolis',
  'America/Jujuy': 'America/Argentina/Jujuy',
  'America/Louisville': 'America/Kentucky/Louisville',
  'America/Mendoza': 'America/Argentina/Mendoza',
  'Asia/Calcutta': 'Asia/Kolkata',
  'Asia/Katmandu': 'Asia/Kathmandu',
  'Asia/Rangoon': 'Asia/Yangon',
  'Asia/Saigon': 'Asia/Ho_Chi_Minh',
  'Atlantic/Faeroe': 'Atlantic/Faroe',
  'Europe/Kiev': 'Europe/Kyiv',
  'Pacific/Enderbury': 'Pacific/Kanton',
  'Pacific/Ponape': 'Pacific/Pohnpei',
  'Pacific/Truk': 'Pacific/Chuuk',
};

/** IANA time zone names the browser knows, under their current names, with UTC, sorted. */
export function allTimeZones(): string[] {
  const zones = new Set(
    Intl.supportedValuesOf('timeZone').map((zone) => {
      const current = RENAMED[zone];
      return current && isValidTimeZone(current) ? current : zone;
    }),
  );
  zones.add('UTC');
  return [...zones].sort();
}

/** Whether the browser accepts the name as a time zone (IANA names and aliases). */
export function isValidTimeZone(name: string): boolean {
  if (!name) return false;
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

/** Zones whose name contains every word typed, matching spaces to underscores ("new york"). */
export function filterTimeZones(zones: readonly string[], query: string, limit = 50): string[] {
  const words = query
    .toLowerCase()
    .replace(/_/g, ' ')
    .split(/[\s/]+/)
    .filter(Boolean);
  if (words.length === 0) return zones.slice(0, limit);
  const matches = zones.filter((zone) => {
    const name = zone.toLowerCase().replace(/_/g, ' ');
    return words.every((word) => name.includes(word));
  });
  return matches.slice(0, limit);
}

/** "UTC+01:00" style offset of a zone at an instant, e.g. for "Europe/London" in July. */
export function utcOffset(timeZone: string, at: Date = new Date()): string {
  const part = new Intl.DateTimeFormat('en-GB', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(at)
    .find((p) => p.type === 'timeZoneName');
  const value = part?.value ?? 'GMT';
  return value === 'GMT' ? 'UTC+00:00' : value.replace('GMT', 'UTC');
}

/** The local time now in a zone, "14:05". */
export function localTime(timeZone: string, at: Date = new Date()): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit' }).format(at);
}
