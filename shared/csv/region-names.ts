// Search-interest exports name a region either by its ISO 3166 code ("US") or in words ("United
// States"); a studio's series of one term in one place must be one series, so both are read as the
// code. Names come from the JavaScript engine's own region names (Intl.DisplayNames, CLDR data).

let byName: Map<string, string> | null = null;

function namesToCodes(): Map<string, string> {
  if (byName) return byName;
  byName = new Map();
  const names = new Intl.DisplayNames(['en'], { type: 'region' });
  const letters = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';
  for (const first of letters) {
    for (const second of letters) {
      const code = first + second;
      let name: string | undefined;
      try {
        name = names.of(code);
      } catch {
        name = undefined;
      }
      // Only a region's canonical code: the engine names old aliases (DD, UK, FX) as the countries
      // their codes now belong to, and canonicalises them to those codes.
      const canonical = Intl.getCanonicalLocales(`und-${code}`)[0]?.split('-')[1];
      if (name && name !== code && canonical === code) byName.set(name.toLowerCase(), code);
    }
  }
  return byName;
}

/** "United States" or "us" → "US"; a region the engine does not name (a state, a city) stays as written. */
export function normaliseRegion(region: string): string {
  const text = region.trim();
  if (/^[A-Za-z]{2}$/.test(text)) return text.toUpperCase();
  return namesToCodes().get(text.toLowerCase()) ?? text;
}
