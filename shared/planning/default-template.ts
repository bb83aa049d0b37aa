import type { RunwayStep } from './runway-types';

export interface RunwayTemplate {
  name: string;
  steps: RunwayStep[];
}

// DESIGN §8: the cautions sit on the steps they concern. They remind; the maker's machine
// manual, local codes and licensed professionals decide.
export const LASER_CAUTIONS: readonly string[] = [
  'Never leave the laser cutter running unattended.',
  'Keep a suitable fire extinguisher at hand.',
  'Cut only materials known to be safe for your machine — never PVC or vinyl.',
  'Vent fumes and dust to the outside as the machine manual says.',
  "Follow your machine's manual and local codes.",
];

export const FINISH_CAUTIONS: readonly string[] = [
  'Apply finishes and let them cure in a well-ventilated space.',
  'Vent fumes and sanding dust; follow the product labels, the machine manual and local codes.',
];

export const PRODUCT_DUTY_CAUTIONS: readonly string[] = [
  'Pieces for children, anything electrical and pieces for outdoor use carry regulatory duties: check them with licensed professionals before selling.',
];

/**
 * The default runway of a laser-cut decor line: 18 work days plus 3 cure days.
 * Cure is not a step of its own but a 3-day lag after Finish (cureDays), so drying runs over a
 * weekend or a holiday without using work days or booking hours.
 */
export const DEFAULT_DECOR_TEMPLATE: RunwayTemplate = {
  name: 'Laser-cut decor line',
  steps: [
    { name: 'Design', kind: 'build', workDays: 3, hoursPerDay: 4, cureDays: 0 },
    {
      name: 'Prototype and test cut',
      kind: 'build',
      workDays: 2,
      hoursPerDay: 4,
      cureDays: 0,
      cautions: [...LASER_CAUTIONS],
    },
    {
      name: 'Batch cut',
      kind: 'build',
      workDays: 3,
      hoursPerDay: 6,
      cureDays: 0,
      cautions: [...LASER_CAUTIONS, ...PRODUCT_DUTY_CAUTIONS],
    },
    {
      name: 'Finish',
      kind: 'build',
      workDays: 2,
      hoursPerDay: 5,
      cureDays: 3,
      cautions: [...FINISH_CAUTIONS],
    },
    {
      name: 'Assemble',
      kind: 'build',
      workDays: 2,
      hoursPerDay: 5,
      cureDays: 0,
      cautions: [...PRODUCT_DUTY_CAUTIONS],
    },
    { name: 'Photograph', kind: 'content', workDays: 1, hoursPerDay: 4, cureDays: 0 },
    { name: 'List', kind: 'content', workDays: 1, hoursPerDay: 3, cureDays: 0 },
    { name: 'Film', kind: 'content', workDays: 1, hoursPerDay: 5, cureDays: 0 },
    { name: 'Edit', kind: 'content', workDays: 2, hoursPerDay: 4, cureDays: 0 },
    { name: 'Publish', kind: 'content', workDays: 1, hoursPerDay: 2, cureDays: 0 },
    { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
  ],
};
