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
    if (patch.timezone !== undefined || patch.country !== undefined || patch.region !== undefined) checkStudioPlace(patch, await this.settings(studio));
    const changed = await this.studios.update(studio.id, patch, patch.version);
    if (changed === 0) {
      throw new AppError('version_conflict', 409, 'Someone else changed the studio settings; reload and try again', undefined, {
        current: await this.settings(studio),
      });
    }
    return this.settings(studio);
  }
}

/**
 * A studio's place as given (at sign-up or in its settings), over what it has now: an IANA time zone,
 * and a country and region the holiday data knows (date-holidays would otherwise fall back to the
 * whole country for a region it does not know). Throws a 400 naming the field.
 */
export function checkStudioPlace(patch: { timezone?: string; country?: string; region?: string | null }, current: { country: string; region: string | null }): void {
  const fail = (field: 'timezone' | 'country' | 'region', message: string) =>
    new AppError('invalid_input', 400, `${field}: ${message}`, [{ path: [field], message }]);
  if (patch.timezone !== undefined && !isTimeZone(patch.timezone)) throw fail('timezone', `${patch.timezone} is not an IANA time zone such as Europe/London`);
  const country = patch.country ?? current.country;
  const region = patch.region !== undefined ? patch.region : current.region;
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
