/**
 * `npm run restore -- FILE.tar.gz --yes [--force]`: brings a backup back (database tables and
 * stored documents). Without --yes it only checks the file and says what it would do; on a
 * database or files folder that holds anything it refuses unless --force (what was there is
 * kept: a dump of the tables and the files folder, in DATA_DIR/before-restore-<time>/). Works on DATABASE_URL or on the private MariaDB of `npm start`
 * (created when there is none yet). Stop the app first: it would serve half-restored data.
 * Exit codes: 0 restored, 1 refused or failed, 2 bad usage, 3 checked only (no --yes).
 */
import { parseArgs } from 'node:util';
import { BackupError, openBackup, restoreBackup } from '../backup/archive.js';
import { commandDatabase } from '../backup/command-database.js';
import { loadConfig } from '../config.js';

const USAGE = 'Usage: npm run restore -- FILE.tar.gz --yes [--force]';

let args;
try {
  args = parseArgs({ options: { yes: { type: 'boolean' }, force: { type: 'boolean' }, help: { type: 'boolean' } }, allowPositionals: true, strict: true });
} catch (error) {
  console.error(`${(error as Error).message}\n${USAGE}`);
  process.exit(2);
}
if (args.values.help) {
  console.log(USAGE);
  process.exit(0);
}
const [file, ...extra] = args.positionals;
if (!file || extra.length > 0) {
  console.error(USAGE);
  process.exit(2);
}

const config = loadConfig();
let exitCode = 0;
try {
  const backup = await openBackup(file);
  try {
    const { manifest } = backup;
    const files = manifest.files.storage === 'local' ? `${manifest.files.count} stored files` : 'no stored files (S3)';
    console.log(`Backup ${file}: made ${manifest.createdAt} from ${manifest.database.source}; ${manifest.database.rows.scenarios ?? 0} scenarios, ${manifest.database.rows.documents ?? 0} documents, ${files}. Checksums match.`);
    if (!args.values.yes) {
      console.log('Nothing changed. Restoring replaces the database tables and stored files: run again with --yes to do it.');
      exitCode = 3;
    } else {
      const database = await commandDatabase(config.dataDir, { create: true });
      try {
        const result = await restoreBackup(config, database, backup, args.values.force === true);
        const rows = result.rows;
        console.log(`Restored into ${database.description}: ${Object.keys(rows).length} tables (${rows.users ?? 0} accounts, ${rows.farms ?? 0} farms, ${rows.scenarios ?? 0} scenarios, ${rows.documents ?? 0} documents).`);
        if (config.storage.kind === 'local') console.log(`Restored ${result.filesRestored} stored files (${result.filesBytes} bytes) into ${config.dataDir}/files.`);
        if (result.setAside) console.log(`What was there before (tables as database.sql, stored files) is kept in ${result.setAside}.`);
        for (const note of result.notes) console.warn(`Note: ${note}`);
        console.log('Start the app as usual; it applies any newer migrations on start.');
      } finally {
        await database.release();
      }
    }
  } finally {
    backup.close();
  }
} catch (error) {
  // A refusal says what happened and that nothing changed; a failure says what broke.
  console.error(error instanceof BackupError ? `Restore refused: ${error.message}` : error instanceof Error ? `Restore failed: ${error.message}` : error);
  exitCode = 1;
}
process.exit(exitCode);
