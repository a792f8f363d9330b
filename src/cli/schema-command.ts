/** `jostle schema`: the JSON Schema of experiment files, for editors. */
import { toEditorSchema } from '../config/json-schema.js';
import { experimentSchema } from '../config/schema.js';
import { EXIT_OK } from './exit.js';

export function schemaCommand(): number {
  const schema = toEditorSchema(experimentSchema, { title: 'jostle experiment', id: 'https://jostle.invalid/schema/experiment.json' });
  process.stdout.write(`${JSON.stringify(schema, null, 2)}\n`);
  return EXIT_OK;
}
