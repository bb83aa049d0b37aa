import { BUILT_IN_TEMPLATE_IDS, BUILT_IN_TEMPLATES, isBuiltInTemplateId } from './built-in-templates';
import { runwayTemplateSchema } from './schemas';

describe('BUILT_IN_TEMPLATES', () => {
  const byName = (id: keyof typeof BUILT_IN_TEMPLATES, name: string) => BUILT_IN_TEMPLATES[id].steps.find((step) => step.name === name)!;

  it.each(BUILT_IN_TEMPLATE_IDS)('when %s is checked by the template schema, then it passes and ends on a launch milestone', (id) => {
    const template = BUILT_IN_TEMPLATES[id];
    expect(runwayTemplateSchema.safeParse(template).success).toBe(true);
    expect(template.steps.at(-1)).toMatchObject({ kind: 'launch', workDays: 0 });
  });

  it('when the work days are summed, then they match the lengths their comments state', () => {
    const workDays = (id: keyof typeof BUILT_IN_TEMPLATES) => BUILT_IN_TEMPLATES[id].steps.reduce((total, step) => total + step.workDays, 0);
    const cureDays = (id: keyof typeof BUILT_IN_TEMPLATES) => BUILT_IN_TEMPLATES[id].steps.reduce((total, step) => total + step.cureDays, 0);
    expect([workDays('bench-piece'), cureDays('bench-piece')]).toEqual([13, 3]);
    expect([workDays('flat-pack-kit'), cureDays('flat-pack-kit')]).toEqual([14, 1]);
    expect([workDays('video-only'), cureDays('video-only')]).toEqual([6, 0]);
  });

  it('when a step concerns tools, finishes, kits or packing, then the DESIGN §8 caution sits beside it', () => {
    expect(byName('bench-piece', 'Mill and rough cut').cautions!.join(' ')).toMatch(/blade guards/);
    expect(byName('bench-piece', 'Sand and finish').cautions!.join(' ')).toMatch(/ventilated.*self-heat/s);
    expect(byName('flat-pack-kit', 'Batch cut parts').cautions!.join(' ')).toMatch(/never PVC or vinyl/);
    expect(byName('flat-pack-kit', 'Kitting').cautions!.join(' ')).toMatch(/choking hazard.*licensed professionals/s);
    expect(byName('flat-pack-kit', 'Packing').cautions!.join(' ')).toMatch(/Count every part/);
    expect(byName('video-only', 'Build on camera').cautions!.join(' ')).toMatch(/tool manual and local codes/);
  });

  it('when ids are tested, then only the built-in string ids count', () => {
    expect(BUILT_IN_TEMPLATE_IDS.map(isBuiltInTemplateId)).toEqual([true, true, true, true]);
    expect([isBuiltInTemplateId('coffee-table'), isBuiltInTemplateId(1)]).toEqual([false, false]);
  });
});
