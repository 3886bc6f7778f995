/**
 * The one reader of a stored scenario document (database rows, versions, files): it brings an
 * older document up to the current format step by step by its `schemaVersion`, then validates it
 * with `scenarioSchema`, so whoever reads a document gets a `Scenario` and never has to cast.
 */
import { scenarioSchema, type Scenario } from './scenario';

/** The format written today (`scenarioSchema.schemaVersion`). */
export const CURRENT_SCHEMA_VERSION = 1;

type Document = Record<string, unknown>;

/**
 * One step per format change: `MIGRATIONS[n]` turns a version-n document into version n + 1.
 * Empty while version 1 is the only format; a change to the format adds its step here.
 */
const MIGRATIONS: Readonly<Record<number, (document: Document) => Document>> = {};

/** A stored document that cannot be read as a scenario; `reason` names the first problem. */
export class StoredScenarioError extends Error {
  constructor(readonly reason: string) {
    super(`Stored scenario document cannot be read: ${reason}`);
    this.name = 'StoredScenarioError';
  }
}

/** The document brought to CURRENT_SCHEMA_VERSION, not yet validated. */
export function migrateScenarioDocument(raw: unknown): Document {
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) throw new StoredScenarioError('not a JSON object');
  let document = raw as Document;
  let version = document.schemaVersion;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) throw new StoredScenarioError('schemaVersion is missing or not a positive whole number');
  if (version > CURRENT_SCHEMA_VERSION) throw new StoredScenarioError(`schemaVersion ${version} is newer than this Byrecast reads (${CURRENT_SCHEMA_VERSION})`);
  while (version < CURRENT_SCHEMA_VERSION) {
    const step = MIGRATIONS[version];
    if (!step) throw new StoredScenarioError(`no migration from schemaVersion ${version}`);
    document = { ...step(document), schemaVersion: version + 1 };
    version += 1;
  }
  return document;
}

/** Reads a stored document as a `Scenario`: migrated, then validated; throws StoredScenarioError naming the first bad field. */
export function readScenarioDocument(raw: unknown): Scenario {
  const parsed = scenarioSchema.safeParse(migrateScenarioDocument(raw));
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new StoredScenarioError(issue ? `${issue.path.join('.') || '(document)'}: ${issue.message}` : 'invalid document');
}
