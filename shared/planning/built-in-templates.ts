import { DEFAULT_DECOR_TEMPLATE, FINISH_CAUTIONS, LASER_CAUTIONS, PRODUCT_DUTY_CAUTIONS, type RunwayTemplate } from './default-template';

// DESIGN §8: each list reminds and defers; the tool's manual, the finish's label, local codes and
// licensed professionals decide. They sit on the steps they concern, like the laser ones.
export const POWER_TOOL_CAUTIONS: readonly string[] = [
  'Keep blade guards on and use push sticks; wear eye and hearing protection.',
  'Collect dust at the tool and vent it; follow the tool manual and local codes.',
];

export const OILY_RAG_CAUTIONS: readonly string[] = [
  'Lay oily finishing rags flat to dry outdoors or keep them in water: they can self-heat and catch fire.',
];

export const KIT_CAUTIONS: readonly string[] = [
  'Small parts in a kit are a choking hazard for young children: label the kit and check the testing and certification duties for children’s products with licensed professionals.',
];

export const PACKING_CAUTIONS: readonly string[] = [
  'Count every part against the sheet before sealing; keep cutters and box knives guarded.',
];

/** The reminder shown beside any cautions field: what the lines are, and who decides. */
export const CAUTION_REMINDER =
  'Cautions remind; they do not replace your machine and tool manuals, the finish labels, local codes or licensed professionals.';

/**
 * A one-off piece made at the bench: 13 work days plus 3 cure days. Lengths are common practice for
 * a small studio (a design week, glue-ups that cure overnight, an oil finish left two days).
 */
export const BENCH_PIECE_TEMPLATE: RunwayTemplate = {
  name: 'Bench-made piece',
  steps: [
    { name: 'Design and cut list', kind: 'build', workDays: 2, hoursPerDay: 4, cureDays: 0 },
    { name: 'Mill and rough cut', kind: 'build', workDays: 2, hoursPerDay: 5, cureDays: 0, cautions: [...POWER_TOOL_CAUTIONS] },
    { name: 'Joinery and glue-up', kind: 'build', workDays: 2, hoursPerDay: 5, cureDays: 1, cautions: [...POWER_TOOL_CAUTIONS] },
    { name: 'Sand and finish', kind: 'build', workDays: 2, hoursPerDay: 4, cureDays: 2, cautions: [...FINISH_CAUTIONS, ...OILY_RAG_CAUTIONS] },
    { name: 'Hardware and final fit', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 0, cautions: [...PRODUCT_DUTY_CAUTIONS] },
    { name: 'Photograph', kind: 'content', workDays: 1, hoursPerDay: 3, cureDays: 0 },
    { name: 'List', kind: 'content', workDays: 1, hoursPerDay: 2, cureDays: 0 },
    { name: 'Film the build', kind: 'content', workDays: 2, hoursPerDay: 4, cureDays: 0 },
    { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
  ],
};

/** A flat-pack kit: parts cut, bagged, an instruction sheet, packed. 14 work days plus 1 cure day (common practice). */
export const FLAT_PACK_KIT_TEMPLATE: RunwayTemplate = {
  name: 'Flat-pack kit',
  steps: [
    { name: 'Design and test fit', kind: 'build', workDays: 3, hoursPerDay: 4, cureDays: 0, cautions: [...KIT_CAUTIONS] },
    { name: 'Batch cut parts', kind: 'build', workDays: 2, hoursPerDay: 6, cureDays: 0, cautions: [...LASER_CAUTIONS] },
    { name: 'Sand and seal', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 1, cautions: [...FINISH_CAUTIONS] },
    { name: 'Instruction sheet', kind: 'content', workDays: 2, hoursPerDay: 3, cureDays: 0, cautions: [...KIT_CAUTIONS] },
    { name: 'Kitting', kind: 'build', workDays: 2, hoursPerDay: 5, cureDays: 0, cautions: [...KIT_CAUTIONS] },
    { name: 'Packing', kind: 'build', workDays: 1, hoursPerDay: 5, cureDays: 0, cautions: [...PACKING_CAUTIONS] },
    { name: 'Photograph and list', kind: 'content', workDays: 1, hoursPerDay: 4, cureDays: 0 },
    { name: 'Film the assembly', kind: 'content', workDays: 2, hoursPerDay: 4, cureDays: 0 },
    { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
  ],
};

/** A how-to video with no piece to sell: 6 work days (common practice for a weekly video). */
export const VIDEO_ONLY_TEMPLATE: RunwayTemplate = {
  name: 'Video only',
  steps: [
    { name: 'Outline and shot list', kind: 'content', workDays: 1, hoursPerDay: 3, cureDays: 0 },
    { name: 'Build on camera', kind: 'content', workDays: 2, hoursPerDay: 5, cureDays: 0, cautions: [...POWER_TOOL_CAUTIONS] },
    { name: 'Edit', kind: 'content', workDays: 2, hoursPerDay: 4, cureDays: 0 },
    { name: 'Thumbnail and description', kind: 'content', workDays: 1, hoursPerDay: 2, cureDays: 0 },
    { name: 'Publish', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
  ],
};

/** The built-in templates' ids, stable in paths and in stored runways; lists show them in this order. */
export const BUILT_IN_TEMPLATE_IDS = ['default', 'bench-piece', 'flat-pack-kit', 'video-only'] as const;
export type BuiltInTemplateId = (typeof BUILT_IN_TEMPLATE_IDS)[number];

export const BUILT_IN_TEMPLATES: Record<BuiltInTemplateId, RunwayTemplate> = {
  default: DEFAULT_DECOR_TEMPLATE,
  'bench-piece': BENCH_PIECE_TEMPLATE,
  'flat-pack-kit': FLAT_PACK_KIT_TEMPLATE,
  'video-only': VIDEO_ONLY_TEMPLATE,
};

export function isBuiltInTemplateId(id: unknown): id is BuiltInTemplateId {
  return (BUILT_IN_TEMPLATE_IDS as readonly unknown[]).includes(id);
}
