import { mean } from 'simple-statistics';
describe('shared project', () => {
  it('runs', () => expect(mean([1, 2, 3])).toBe(2));
});
