import type { ThemeStatus } from '@shared/contracts/themes';

export const statusLabels: Record<ThemeStatus, string> = {
  idea: 'Idea',
  shortlisted: 'Shortlisted',
  picked: 'Picked',
  building: 'Building',
  launched: 'Launched',
  retired: 'Retired',
};
