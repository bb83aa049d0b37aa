import { parseSeriesHeader } from './csv-headers';
import { normaliseRegion } from './region-names';

describe('region names', () => {
  it('when a region is written in words or as a code in any case, then it is read as its ISO 3166 code', () => {
    // Outside reference: the ISO 3166 codes of these countries (from memory), and the engine's own
    // CLDR names that the lookup is built from.
    const names = new Intl.DisplayNames(['en'], { type: 'region' });
    expect([names.of('US'), names.of('GB'), names.of('DE')]).toEqual(['United States', 'United Kingdom', 'Germany']);
    expect(['United States', 'united kingdom', 'Germany', 'us', 'GB'].map(normaliseRegion)).toEqual(['US', 'GB', 'DE', 'US', 'GB']);
    expect(normaliseRegion('Ontario')).toBe('Ontario');
  });

  it('when a wide header names its region, then the term keeps no region and the region is the code', () => {
    expect(parseSeriesHeader('lantern: (United States)')).toEqual({ term: 'lantern', region: 'US' });
    expect(parseSeriesHeader('lantern: (US)')).toEqual({ term: 'lantern', region: 'US' });
    expect(parseSeriesHeader('paper lantern')).toEqual({ term: 'paper lantern' });
  });
});
