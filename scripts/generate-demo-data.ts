// Writes the demo studio's CSV files into data/: invented search-interest and sales figures of our
// own scenario, made deterministic by a seeded PRNG so the files only change when this script does.
// Run: npx tsx scripts/generate-demo-data.ts   (checks each file with the import code before writing)
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { readCsvText, writeCsv } from '../shared/csv/index';
import { mulberry32 } from '../shared/seeded-random';

const dayMs = 86_400_000;
const dataDirectory = join(__dirname, '..', 'data');


const random = mulberry32(20211107);
/** Roughly normal noise (sum of uniforms), mean 0 and about unit spread. */
const noise = () => random() + random() + random() + random() - 2;
const isoDate = (time: number) => new Date(time).toISOString().slice(0, 10);

/** A seasonal bump peaking on `peakDay` of the year (0–365), `width` days wide. */
function seasonBump(dayOfYear: number, peakDay: number, width: number): number {
  const distance = Math.min(Math.abs(dayOfYear - peakDay), 365 - Math.abs(dayOfYear - peakDay));
  return Math.exp(-(distance * distance) / (2 * width * width));
}

interface TermModel {
  name: string;
  /** Raw interest for a date: `years` since the start of the file, `day` of the year. */
  level(years: number, day: number, time: number): number;
}

const spikeWeek = Date.parse('2025-03-09');
const terms: TermModel[] = [
  { name: 'herb planter box', level: (_, day) => 12 + 70 * seasonBump(day, 115, 30) },
  { name: 'pumpkin porch sign', level: (_, day) => 3 + 62 * seasonBump(day, 280, 18) },
  { name: 'lantern panel', level: (years, day) => 8 + 78 * seasonBump(day, 352, 14) * (1 + 0.04 * years) },
  { name: 'hex wall shelf', level: (years, day) => 6 + 9 * years * (1 + 0.15 * seasonBump(day, 20, 40)) },
  { name: 'cork board map', level: (years) => Math.max(0.2, 34 * Math.exp(-0.75 * years)) },
  {
    name: 'moon phase wall hanging',
    // A short burst after a popular video, then a small lasting lift.
    level: (_, __, time) => {
      const weeksAfter = (time - spikeWeek) / (7 * dayMs);
      return 5 + (weeksAfter >= 0 ? 92 * Math.exp(-weeksAfter / 2.2) + 4 : 0);
    },
  },
];

function dayOfYear(time: number): number {
  const date = new Date(time);
  return (time - Date.UTC(date.getUTCFullYear(), 0, 1)) / dayMs;
}

/** Scales raw levels so the highest of the whole file is 100, as export tools do; tiny values read "<1". */
function toInterestCells(raw: number[][]): string[][] {
  const highest = Math.max(...raw.flat());
  return raw.map((row) =>
    row.map((value) => {
      const scaled = (value / highest) * 100;
      return scaled > 0 && scaled < 1 ? '<1' : String(Math.round(scaled));
    }),
  );
}

function weeklyInterest(): string {
  const start = Date.parse('2021-11-07');
  const end = Date.parse('2026-11-22');
  const dates: number[] = [];
  for (let time = start; time <= end; time += 7 * dayMs) dates.push(time);
  const raw = dates.map((time) =>
    terms.map((term) => {
      const years = (time - start) / (365.25 * dayMs);
      const level = term.level(years, dayOfYear(time), time);
      return Math.max(0.3, level * (1 + 0.08 * noise()) + 1.5 * noise());
    }),
  );
  const cells = toInterestCells(raw);
  const header = ['Week', ...terms.map((term) => `${term.name}: (US)`)];
  const table = [header, ...dates.map((time, i) => [isoDate(time), ...cells[i]])];
  const preamble = 'Weekly search interest, 0 to 100 (100 = busiest week of all terms)\nDemo studio figures, invented for Kerfcast\n\n';
  return preamble + writeCsv(table, { lineEnd: '\n' }) + '\n';
}

function monthlyInterestLong(): string {
  const chosen = [terms[0], terms[2], terms[3]];
  const months: number[] = [];
  for (let month = 0; month < 60; month++) months.push(Date.UTC(2021, 11 + month, 1));
  const raw = months.map((time) =>
    chosen.map((term) => {
      const years = (time - months[0]) / (365.25 * dayMs);
      return Math.max(0.3, term.level(years, dayOfYear(time) + 15, time) * (1 + 0.05 * noise()));
    }),
  );
  const cells = toInterestCells(raw);
  const rows = months.flatMap((time, i) =>
    chosen.map((term, j) => [isoDate(time).slice(0, 7), term.name, cells[i][j], 'US']),
  );
  return writeCsv([['month', 'term', 'value', 'region'], ...rows], { lineEnd: '\n' }) + '\n';
}

interface ItemModel {
  name: string;
  sku: string;
  priceCents: number;
  /** Sales pull from one of the interest terms, or a flat demand. */
  demand(time: number): number;
}

const interestOf = (index: number) => (time: number) =>
  terms[index].level((time - Date.parse('2021-11-07')) / (365.25 * dayMs), dayOfYear(time), time) / 40;

const items: ItemModel[] = [
  { name: 'Herb planter box', sku: 'HPB-01', priceCents: 3800, demand: interestOf(0) },
  { name: 'Lantern panel, walnut', sku: 'LNT-WAL', priceCents: 5400, demand: interestOf(2) },
  { name: 'Lantern panel, birch', sku: 'LNT-BIR', priceCents: 4800, demand: interestOf(2) },
  { name: 'Pumpkin porch sign', sku: 'PPS-01', priceCents: 3200, demand: interestOf(1) },
  { name: 'Hex wall shelf', sku: 'HEX-03', priceCents: 4500, demand: interestOf(3) },
  { name: 'Moon phase wall hanging', sku: 'MPH-01', priceCents: 2900, demand: interestOf(5) },
  { name: 'Garden stake set', sku: 'GSS-06', priceCents: 1800, demand: interestOf(0) },
  { name: 'Star garland kit "do it yourself"', sku: 'SGK-01', priceCents: 2200, demand: (time) => 0.2 + interestOf(2)(time) / 2 },
];

/** Draws a count with the given mean (Knuth's method; means here stay small). */
function poisson(mean: number): number {
  const limit = Math.exp(-mean);
  let count = 0;
  for (let product = random(); product > limit; product *= random()) count++;
  return count;
}

function sales(): string {
  const rows: string[][] = [];
  const refunds: { time: number; row: string[] }[] = [];
  const money = (cents: number) => (cents / 100).toFixed(2);
  for (let time = Date.parse('2023-11-01'); time <= Date.parse('2026-10-31'); time += dayMs) {
    const weekday = new Date(time).getUTCDay();
    // Saturday markets; the booth sells every day a little; online every day.
    const channels: [string, number][] = [['online', 0.16], ['booth', 0.06]];
    if (weekday === 6) channels.push(['market', 0.9]);
    for (const [channel, rate] of channels) {
      for (const item of items) {
        const count = poisson(rate * item.demand(time));
        for (let sale = 0; sale < count; sale++) {
          const quantity = channel === 'market' && random() < 0.2 ? 2 : 1;
          const row = [isoDate(time), item.name, item.sku, String(quantity), money(quantity * item.priceCents), channel, 'USD'];
          rows.push(row);
          if (channel === 'online' && random() < 0.025) refunds.push({ time: time + (3 + Math.floor(random() * 10)) * dayMs, row });
        }
      }
    }
    for (const refund of refunds.filter((entry) => entry.time === time)) {
      const [, name, sku, quantity, revenue] = refund.row;
      rows.push([isoDate(time), name, sku, `-${quantity}`, `-${revenue}`, 'online', 'USD']);
    }
  }
  return writeCsv([['date', 'item', 'sku', 'quantity', 'revenue', 'channel', 'currency'], ...rows], { lineEnd: '\n' }) + '\n';
}

/** Reads a generated file back through the import code; a demo file with errors is a bug here. */
function checkAndWrite(fileName: string, text: string): void {
  const result = readCsvText(text);
  const errors = result.summary.problems.filter((problem) => problem.severity === 'error');
  if (errors.length > 0) throw new Error(`${fileName}: ${JSON.stringify(errors.slice(0, 3))}`);
  writeFileSync(join(dataDirectory, fileName), text);
  const size = Math.round(Buffer.byteLength(text) / 1024);
  const { layout, period, headerRow } = result.preview;
  console.log(`${fileName}: ${layout}, ${period}, header on line ${headerRow}, ${result.records.length} records, ${size} KB`);
}

checkAndWrite('interest-weekly.csv', weeklyInterest());
checkAndWrite('interest-long-monthly.csv', monthlyInterestLong());
checkAndWrite('sales.csv', sales());
