import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { scenarioSchema } from '../../shared/schema';

/**
 * Writes shared/schema/scenario.schema.json, the JSON Schema of a scenario file as accepted
 * on input (defaults may be left out), for editors and outside tools.
 */
const target = fileURLToPath(new URL('../../shared/schema/scenario.schema.json', import.meta.url));
const jsonSchema = z.toJSONSchema(scenarioSchema, { io: 'input', target: 'draft-2020-12' });
writeFileSync(target, `${JSON.stringify(jsonSchema, null, 2)}\n`);
process.stdout.write(`Wrote ${target}\n`);
