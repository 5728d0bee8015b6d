import { configJsonSchema } from '../experiment/schema.js';

/** `crosswise schema`: prints the config JSON Schema, for editors (`crosswise schema > crosswise.schema.json`). */
export async function schemaCommand(args: readonly string[]): Promise<number> {
  if (args.length > 0) {
    console.error(`crosswise schema: takes no arguments, got ${args.join(' ')}`);
    return 1;
  }
  const schema = { ...configJsonSchema(), title: 'crosswise sweep config' };
  console.log(JSON.stringify(schema, null, 2));
  return 0;
}
