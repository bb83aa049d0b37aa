import { makeTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

// The knexfile pins how mysql2 hands back column types; these are the types every repository relies on.
describe('database driver settings', () => {
  it('when a DECIMAL, BIGINT, DATE and BOOLEAN come back, then they are number, number, ISO string and boolean', async () => {
    const [rows] = await t.db.raw(
      "SELECT CAST(7.25 AS DECIMAL(5,2)) AS hours, CAST(9007199254740 AS SIGNED) AS cents, DATE('2026-03-29') AS day, CAST(1 AS UNSIGNED) = 1 AS flag",
    );
    expect(rows[0]).toEqual({ hours: 7.25, cents: 9007199254740, day: '2026-03-29', flag: 1 });
    const studio = await t.db('studios').insert({ name: 'Types check' });
    const row = await t.db('studios').where({ id: studio[0] }).first();
    expect(row.daily_capacity_hours).toBe(8);
    expect(row.holidays_off).toBe(true);
  });

  it('when a DATE column is read back across a DST change, then the calendar day is unchanged (no time-zone shift)', async () => {
    const [rows] = await t.db.raw("SELECT DATE('2026-03-08') AS us_dst, DATE('2026-10-25') AS eu_dst");
    expect(rows[0]).toEqual({ us_dst: '2026-03-08', eu_dst: '2026-10-25' });
  });
});
