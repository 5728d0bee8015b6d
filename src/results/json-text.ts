import type { z } from 'zod';

/** The value of a JSON file's text; text that is not JSON is one line naming the file. */
export function parseJsonText(text: string, fileName: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    throw new Error(`${fileName}: not valid JSON (${(error as Error).message})`);
  }
}

/** A value checked against its schema; the first problem is one line naming the file and the key. */
export function checkedJson<S extends z.ZodType>(schema: S, json: unknown, fileName: string): z.infer<S> {
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new Error(`${fileName}: ${issue.path.join('.') || '(top level)'}: ${issue.message}`);
  }
  return parsed.data;
}
