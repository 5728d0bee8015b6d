import { configJsonSchema } from '../experiment/schema.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { schemaUsage } from './schema-usage.js';

/** `crosswise schema`: prints the config JSON Schema, for editors (see schema-usage.ts). */
export async function schemaCommand(args: readonly string[]): Promise<number> {
  return runAction(schemaUsage, args, async () => {
    const schema = { ...configJsonSchema(), title: 'crosswise sweep config' };
    console.log(JSON.stringify(schema, null, 2));
    return EXIT.success;
  });
}
