/**
 * `npm run backup [-- --out FILE.tar.gz|DIR]`: the database (one consistent mariadb-dump) and
 * the stored documents in one .tar.gz with a manifest, by default in backups/ under the current
 * directory. Works on DATABASE_URL or on the private MariaDB of `npm start` (running or not).
 * Exit codes: 0 written, 1 failed (nothing left behind), 2 bad usage.
 */
import { parseArgs } from 'node:util';
import { createBackup } from '../backup/archive.js';
import { commandDatabase } from '../backup/command-database.js';
import { loadConfig } from '../config.js';

const USAGE = 'Usage: npm run backup [-- --out FILE.tar.gz | --out DIRECTORY]';

function megabytes(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

let args;
try {
  args = parseArgs({ options: { out: { type: 'string', default: 'backups' }, help: { type: 'boolean' } }, strict: true });
} catch (error) {
  console.error(`${(error as Error).message}\n${USAGE}`);
  process.exit(2);
}
if (args.values.help) {
  console.log(USAGE);
  process.exit(0);
}

const config = loadConfig();
let exitCode = 0;
try {
  const database = await commandDatabase(config.dataDir, { create: false });
  try {
    const { file, manifest } = await createBackup(config, database, args.values.out);
    const rows = manifest.database.rows;
    console.log(`Backup written: ${file}`);
    console.log(`  database: ${manifest.database.source}, ${Object.keys(rows).length} tables (${rows.farms ?? 0} farms, ${rows.scenarios ?? 0} scenarios, ${rows.scenario_versions ?? 0} versions, ${rows.documents ?? 0} documents), dump ${megabytes(manifest.database.bytes)}`);
    if (manifest.files.storage === 'local') {
      console.log(`  stored files: ${manifest.files.count} (${megabytes(manifest.files.bytes)}) from ${config.dataDir}/files`);
      if (manifest.files.missing.length > 0) console.warn(`  warning: ${manifest.files.missing.length} documents have no stored file: ${manifest.files.missing.join(', ')}`);
    } else {
      console.warn(`  stored files: NOT included — ${manifest.files.note}`);
    }
    console.log('Keep a copy somewhere else than this machine.');
  } finally {
    await database.release();
  }
} catch (error) {
  // A refusal or a failed tool says what happened; only a bug shows its stack.
  console.error(error instanceof Error ? `Backup failed: ${error.message}` : error);
  exitCode = 1;
}
process.exit(exitCode);
