import type { Knex } from 'knex';
import type { StudioSettings, StudioSettingsPatch, StudioSummary } from '@shared/contracts/studios';
import { isValidRegion } from '@shared/calendar/holidays';
import { AppError, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { StudioRepository } from './studio-repository';

export class StudioService {
  private readonly studios: StudioRepository;

  constructor(db: Knex) {
    this.studios = new StudioRepository(db);
  }

  async settings(studio: StudioContext): Promise<StudioSettings> {
    const settings = await this.studios.find(studio.id, studio.role);
    if (!settings) throw notFound('Studio');
    return settings;
  }

  async summary(studio: StudioContext): Promise<StudioSummary> {
    return this.studios.summary(studio.id);
  }

  async update(studio: StudioContext, patch: StudioSettingsPatch): Promise<StudioSettings> {
    if (patch.timezone !== undefined && !isTimeZone(patch.timezone)) {
      throw new AppError('invalid_input', 400, `timezone: ${patch.timezone} is not an IANA time zone such as Europe/London`, [
        { path: ['timezone'], message: 'Not an IANA time zone such as Europe/London' },
      ]);
    }
    if (patch.country !== undefined || patch.region !== undefined) checkPlace(await this.settings(studio), patch);
    const changed = await this.studios.update(studio.id, patch, patch.version);
    if (changed === 0) {
      throw new AppError('version_conflict', 409, 'Someone else changed the studio settings; reload and try again', undefined, {
        current: await this.settings(studio),
      });
    }
    return this.settings(studio);
  }
}

// The holiday data decides which countries and regions exist (date-holidays would otherwise fall
// back to the whole country for a region it does not know).
function checkPlace(current: StudioSettings, patch: StudioSettingsPatch): void {
  const country = patch.country ?? current.country;
  const region = patch.region !== undefined ? patch.region : current.region;
  const fail = (field: 'country' | 'region', message: string) =>
    new AppError('invalid_input', 400, `${field}: ${message}`, [{ path: [field], message }]);
  if (!isValidRegion(country)) throw fail('country', `${country} is not a country the public-holiday data knows`);
  if (region && !isValidRegion(country, region)) throw fail('region', `${region} is not a region of ${country} in the public-holiday data`);
}

function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}
