/**
 * Writes src/lib/api/response-shapes.gen.ts: the JSON Schema of each shared zod schema that the first page
 * checks its answers with (DEVELOPERS.md, "First page without zod"). Run `npm run shapes` after changing one
 * of these schemas; src/lib/api/response-shapes.test.ts fails while the file is out of date.
 */
import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { ErrorBodySchema } from '../shared/errors';
import { SessionInfoSchema } from '../shared/schemas/auth';
import { ClubSettingsSchema } from '../shared/schemas/clubs';
import { pageSchema } from '../shared/schemas/common';
import { MyFeesListSchema } from '../shared/schemas/fees';
import { MyPlotSchema } from '../shared/schemas/my-plot';
import { PlotBookSchema } from '../shared/schemas/plot-book';
import { PlotSchema } from '../shared/schemas/plots';
import { PlotTasksSchema } from '../shared/schemas/tasks';

/** Each shape: its zod schema and the TypeScript type of its parsed value (written as the generated file imports it). */
const SHAPES: Record<string, { schema: z.ZodType; type: string; imports: string }> = {
  ErrorBodyShape: { schema: ErrorBodySchema, type: 'ErrorBody', imports: "import type { ErrorBody } from '@shared/errors';" },
  CsrfCarrierShape: { schema: z.object({ csrfToken: z.string().min(1) }), type: '{ csrfToken: string }', imports: '' },
  SessionInfoShape: { schema: SessionInfoSchema, type: 'SessionInfo', imports: "import type { SessionInfo } from '@shared/schemas/auth';" },
  ClubSettingsShape: { schema: ClubSettingsSchema, type: 'ClubSettings', imports: "import type { ClubSettings } from '@shared/schemas/clubs';" },
  PlotsPageShape: {
    schema: pageSchema(PlotSchema),
    type: '{ items: Plot[]; page: number; total: number }',
    imports: "import type { Plot } from '@shared/schemas/plots';",
  },
  PlotTasksShape: { schema: PlotTasksSchema, type: 'PlotTasks', imports: "import type { PlotTasks } from '@shared/schemas/tasks';" },
  MyPlotShape: { schema: MyPlotSchema, type: 'MyPlot', imports: "import type { MyPlot } from '@shared/schemas/my-plot';" },
  // The holder's home counts the neighbour check's findings from the plot book: only their severities.
  PlotBookSeveritiesShape: {
    schema: z.object({ findings: z.array(PlotBookSchema.shape.findings.element.pick({ severity: true })) }),
    type: "{ findings: Array<{ severity: PlotBook['findings'][number]['severity'] }> }",
    imports: "import type { PlotBook } from '@shared/schemas/plot-book';",
  },
  MyFeesListShape: { schema: MyFeesListSchema, type: 'z.output<typeof MyFeesListSchema>', imports: "import type { MyFeesListSchema } from '@shared/schemas/fees';\nimport type { z } from 'zod';" },
};

/** The keywords src/lib/api/shape.ts checks; a schema whose JSON Schema uses any other one is refused here. */
const KNOWN = new Set([
  '$schema', 'type', 'properties', 'required', 'additionalProperties', 'propertyNames', 'items', 'enum', 'const', 'anyOf',
  'minimum', 'maximum', 'exclusiveMinimum', 'exclusiveMaximum', 'minLength', 'maxLength', 'minItems', 'maxItems', 'pattern',
]);

function checkKeywords(name: string, node: unknown, at: string): void {
  if (Array.isArray(node)) return node.forEach((item, i) => checkKeywords(name, item, `${at}[${i}]`));
  if (typeof node !== 'object' || node === null) return;
  for (const [key, value] of Object.entries(node)) {
    if (!KNOWN.has(key)) throw new Error(`${name}: ${at}.${key} is a JSON Schema keyword src/lib/api/shape.ts does not check`);
    if (key === 'properties') for (const [prop, sub] of Object.entries(value as object)) checkKeywords(name, sub, `${at}.properties.${prop}`);
    else if (key !== 'enum' && key !== 'const' && key !== 'required') checkKeywords(name, value, `${at}.${key}`);
  }
}

/** The generated file's text. `z.toJSONSchema` throws on what JSON Schema cannot say (transforms, custom checks). */
export function responseShapesSource(): string {
  const imports = new Set<string>();
  const body: string[] = [];
  for (const [name, { schema, type, imports: line }] of Object.entries(SHAPES)) {
    const json = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'throw' }) as Record<string, unknown>;
    delete json.$schema;
    checkKeywords(name, json, name);
    for (const one of line.split('\n')) if (one) imports.add(one);
    body.push(`export const ${name}: Shape<${type}> = { schema: ${JSON.stringify(json)} };`);
  }
  return [
    '// Written by scripts/response-shapes.ts from the shared zod schemas (`npm run shapes`); do not edit by hand.',
    ...[...imports].sort(),
    "import type { Shape } from './shape';",
    '',
    ...body,
    '',
  ].join('\n');
}

export const RESPONSE_SHAPES_FILE = path.resolve(import.meta.dirname, '..', 'src', 'lib', 'api', 'response-shapes.gen.ts');

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) {
  fs.writeFileSync(RESPONSE_SHAPES_FILE, responseShapesSource());
  console.log(`Wrote ${path.relative(process.cwd(), RESPONSE_SHAPES_FILE)}`);
}
