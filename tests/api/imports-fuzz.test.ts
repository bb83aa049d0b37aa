// Issue #22: a property-based fuzz test of the CSV import through HTTP and the real MariaDB.
// Files of sales and search interest mix sound cells with the ones clients send (numbers past the
// columns, cells of thousands of characters, dates out of range, formulas, quotes, blanks). For
// every file: no answer is a 5xx, a commit stores all of the file or none of it, the commit agrees
// with the preview, and every problem names a row of the file and, for a cell, its column.
import fc from 'fast-check';
import { fixedClock, useClock } from '../../server/clock/clock';
import { makeStudio, signIn, type Agent } from '../helpers/test-app';
import { aFile, type FuzzFile } from './imports-fuzz-files';
import { nothingStored, useImportsApp } from './imports-kit';

const runs = Number(process.env['FUZZ_RUNS'] ?? 300);
const kit = useImportsApp();
let agent: Agent;
let userId: number;
let restoreClock: () => void;

beforeAll(async () => {
  // Sales dates are checked against the studio's today: 15 March 2026 (window 1990-01-01 to 2027-03-15).
  restoreClock = useClock(fixedClock('2026-03-15T12:00:00Z'));
  const studio = await makeStudio(kit.t.db, ['owner']);
  userId = studio.members.owner.id;
  agent = await signIn(kit.t.app, studio.members.owner.email);
});
afterAll(() => restoreClock());

/** A studio of its own per file, so merges and same-file checks never join two files. */
async function freshStudio(): Promise<number> {
  const [studioId] = await kit.t.db('studios').insert({ name: 'Fuzz studio' });
  await kit.t.db('memberships').insert({ studio_id: studioId, user_id: userId, role: 'owner' });
  return studioId;
}

interface Problem {
  row: number;
  column: string | null;
  code: string;
}

// Problems about a whole row or the whole file; every other problem is about one cell.
const rowOrFileCodes = new Set(['row-too-long', 'unclosed-quote', 'too-many-problems', 'invalid-mapping', 'mixed-period']);
const sqlWords = /INSERT INTO|UPDATE `|SELECT |Data too long|Out of range value|ER_[A-Z_]+/;
const figures = { files: 0, committed: 0, refused: 0, rejectedAtUpload: 0 };

/**
 * Every problem names a line of the file, and a cell problem a column of the header the preview
 * found (the written one, unless a row without a date made it take the next row for the header).
 */
function checkProblems(file: FuzzFile, problems: Problem[], header: string[]): void {
  for (const problem of problems) {
    expect(Number.isInteger(problem.row) && problem.row >= 1 && problem.row <= file.lines).toBe(true);
    if (problem.column !== null) expect(header).toContain(problem.column);
    else expect([problem.code, rowOrFileCodes.has(problem.code)]).toEqual([problem.code, true]);
  }
}

const issuesOf = (body: { error: { issues?: (Problem & { column?: string })[] } }) =>
  (body.error.issues ?? []).map((issue) => ({ ...issue, code: issue.code ?? 'issue', column: issue.column ?? null }));

async function importOnce(file: FuzzFile): Promise<void> {
  figures.files++;
  const studioId = await freshStudio();
  const preview = await kit.upload(agent, studioId, file.text);
  expect(preview.status).toBeLessThan(500);
  if (preview.status !== 201) {
    figures.rejectedAtUpload++;
    expect(preview.status).toBe(400);
    // Nothing was previewed: a column named here is a cell of the file's first rows.
    const cells = file.text.split(/\r\n|\r|\n/).slice(0, 5).flatMap((line) => line.split(/[,;\t]/));
    for (const issue of issuesOf(preview.body)) expect(Number.isInteger(issue.row) && issue.row >= 1 && issue.row <= file.lines).toBe(true);
    expect(issuesOf(preview.body).every((issue) => issue.column === null || file.text.includes(issue.column) || cells.includes(issue.column))).toBe(true);
    expect(await kit.t.db('imports').where({ studio_id: studioId }).first()).toBeUndefined();
    return;
  }
  const header = (preview.body.columns as { name: string }[]).map((column) => column.name);
  checkProblems(file, preview.body.problems, header);
  const order = preview.body.dateAmbiguous ? { dateOrder: 'MDY' } : {};
  const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send(order);
  expect(commit.status).toBeLessThan(500);
  const after = await kit.stored(studioId);
  if (commit.status === 200) {
    figures.committed++;
    expect(preview.body.hasErrors).toBe(false);
    // All of what the preview showed: each data row a sale, or a point per row and series column.
    const seriesColumns = (preview.body.columns as { role: string }[]).filter((column) => column.role === 'series').length;
    if (file.kind === 'sales') expect(after.sales).toBe(preview.body.rows);
    else expect(after.points).toBe(preview.body.layout === 'wide' ? preview.body.rows * seriesColumns : preview.body.rows);
    expect(after.history).toBeGreaterThan(0);
  } else {
    figures.refused++;
    expect([commit.status, commit.body.error.code]).toEqual([400, expect.stringMatching(/^(file_has_problems|date_order_needed)$/)]);
    expect(preview.body.hasErrors || preview.body.dateAmbiguous).toBe(true);
    expect(after).toEqual(nothingStored);
    for (const issue of issuesOf(commit.body)) {
      expect(Number.isInteger(issue.row) && issue.row >= 1 && issue.row <= file.lines).toBe(true);
      if (issue.column !== null) expect(header).toContain(issue.column);
    }
  }
  const detail = await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`);
  expect(detail.status).toBe(200);
  expect(detail.body.failure ?? '').not.toMatch(sqlWords);
}

describe('fuzzing the CSV import', () => {
  it(`when ${runs} generated files are uploaded and committed, then none answers 5xx, none is stored in part, and every problem names its row and column`, async () => {
    const started = Date.now();
    await fc.assert(fc.asyncProperty(aFile, importOnce), { numRuns: runs, endOnFailure: true });
    // The figures of the run, for the record (not a check).
    console.log(`imports fuzz: ${JSON.stringify(figures)} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
    expect(figures.committed).toBeGreaterThan(0);
    expect(figures.refused).toBeGreaterThan(0);
  }, 600_000);
});
