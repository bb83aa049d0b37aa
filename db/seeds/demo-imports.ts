import fs from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { ImportService } from '../../server/imports/import-service';
import { defaultUploadDirectory } from '../../server/imports/imports-router';

// The demo studio's CSV files, imported through the same service path as a user's upload.
export const demoImportFiles = ['interest-weekly.csv', 'interest-long-monthly.csv', 'sales.csv'] as const;
const dataDir = path.resolve(__dirname, '../../data');

/** Idempotent: a file already committed in the studio (by name) is left alone. */
export async function seedDemoImports(db: Knex, studioId: number, ownerId: number): Promise<number[]> {
  const service = new ImportService(db);
  const studio = { id: studioId, role: 'owner' as const };
  const owner = await db('users').where({ id: ownerId }).first('id', 'email', 'name');
  const done = new Set((await service.list(studio)).filter((item) => item.status === 'committed').map((item) => item.fileName));
  const directory = defaultUploadDirectory();
  await fs.promises.mkdir(directory, { recursive: true });
  const committed: number[] = [];
  for (const name of demoImportFiles) {
    if (done.has(name)) continue;
    // A copy stands in for multer's stored upload; the service removes it once committed.
    // The real clock only makes the stored file's name unique.
    const stored = path.join(directory, `demo-${studioId}-${Date.now()}-${name}`);
    await fs.promises.copyFile(path.join(dataDir, name), stored);
    const { size } = await fs.promises.stat(stored);
    const preview = await service.upload(studio, owner, { path: stored, originalName: name, size }, {});
    const result = await service.commit(studio, preview.id, {});
    committed.push(result.id);
  }
  return committed;
}
