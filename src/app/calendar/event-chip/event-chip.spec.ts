import type { CalendarEvent } from '@shared/contracts/calendar';
import { chipViewOf } from '../chip-view';
import { drawChips } from './event-chip';

function event(id: string, overrides: Partial<CalendarEvent> = {}): CalendarEvent {
  return {
    id,
    kind: 'build',
    title: `Step ${id}`,
    start: '2026-12-08',
    end: '2026-12-08',
    allDay: true,
    editable: true,
    version: 1,
    runwayId: 5,
    stepIndex: 0,
    workDays: 1,
    hoursPerDay: 4,
    cureDays: 0,
    themeId: 9,
    themeName: 'Herb garden',
    assigneeId: null,
    assigneeName: null,
    cautions: [],
    ...overrides,
  };
}

const titles = (box: HTMLElement) => [...box.querySelectorAll('button.chip > .title')].map((title) => title.textContent);

describe('drawChips', () => {
  it('when a day is drawn, then each event is a button chip with its kind, id, name and title, in order', () => {
    const box = document.createElement('div');
    drawChips(box, [chipViewOf(event('1', { assigneeName: 'Tobin Ashgrove' }), true), chipViewOf(event('2', { kind: 'market', hours: '9:00–15:00' }), false)]);
    const [first, second] = [...box.children] as HTMLButtonElement[];
    expect(titles(box)).toEqual(['Step 1', 'Step 2']);
    expect([first.type, first.dataset['kind'], first.dataset['eventId'], first.dataset['initials']]).toEqual(['button', 'build', '1', 'TA']);
    expect([first.classList.contains('fixed'), first.classList.contains('done')]).toEqual([false, false]);
    expect(first.getAttribute('aria-keyshortcuts')).toContain('ArrowLeft');
    expect(first.getAttribute('aria-label')).toBe('Build day: Step 1, Tuesday, December 8, assigned to Tobin Ashgrove');
    expect([second.dataset['hours'], second.dataset['initials'], second.classList.contains('fixed'), second.hasAttribute('aria-keyshortcuts')]).toEqual(['9:00–15:00', undefined, true, false]);
  });

  it('when the day is drawn again, then the buttons of events still there are kept (reordered, updated) and the others removed', () => {
    const box = document.createElement('div');
    drawChips(box, ['1', '2', '3'].map((id) => chipViewOf(event(id), true)));
    const [one, two] = [...box.children];
    drawChips(box, [chipViewOf(event('2', { done: true, title: 'Renamed' }), true), chipViewOf(event('4'), true), chipViewOf(event('1'), true)]);
    expect(titles(box)).toEqual(['Renamed', 'Step 4', 'Step 1']);
    expect(box.children[0]).toBe(two);
    expect(box.children[2]).toBe(one);
    expect(box.children[0].classList.contains('done')).toBe(true);
    expect(box.querySelector('[data-event-id="3"]')).toBeNull();
    drawChips(box, []);
    expect(box.children.length).toBe(0);
  });

  it('when the same views are drawn again, then nothing is written', () => {
    const box = document.createElement('div');
    const views = [chipViewOf(event('1'), true)];
    drawChips(box, views);
    const chip = box.firstElementChild!;
    const setAttribute = jest.spyOn(chip, 'setAttribute');
    drawChips(box, views);
    expect(setAttribute).not.toHaveBeenCalled();
    expect(box.firstElementChild).toBe(chip);
  });

  it('when a step breaks a rule now, then its chip is marked and its label says which rule; a fixed one is not', () => {
    const box = document.createElement('div');
    const broken = event('3', { problems: [{ code: 'blackout', message: 'Paint: 2026-12-08 is a market day' }] });
    drawChips(box, [chipViewOf(broken, true), chipViewOf(event('4', { problems: [] }), true)]);
    const [first, second] = [...box.children] as HTMLButtonElement[];
    expect([first.classList.contains('broken'), second.classList.contains('broken')]).toEqual([true, false]);
    expect(first.getAttribute('aria-label')).toBe('Build day: Step 3, Tuesday, December 8, breaks a rule now: Paint: 2026-12-08 is a market day');
  });
});
