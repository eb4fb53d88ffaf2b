/**
 * docs/configuration.md, made from the configuration schema itself (src/ingest/config.ts): every
 * key of bulletin.json with its type, default and meaning. `npm run docs:configuration` writes it;
 * test/docs/configuration.test.ts fails when the committed file differs from a fresh one, or when
 * a key has no description.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { configSchema } from '../../src/ingest/config.ts';

interface JsonSchema {
  type?: string | string[];
  description?: string;
  default?: unknown;
  enum?: unknown[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  anyOf?: JsonSchema[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  pattern?: string;
}

export interface SettingRow {
  key: string;
  type: string;
  required: boolean;
  default: string;
  meaning: string;
}

function typeOf(schema: JsonSchema): string {
  if (schema.enum) return schema.enum.map((value) => JSON.stringify(value)).join(', ');
  if (schema.anyOf) return schema.anyOf.map(typeOf).join(' or ');
  const type = Array.isArray(schema.type) ? schema.type.join(' or ') : (schema.type ?? 'any');
  const bounds: string[] = [];
  if (schema.minimum !== undefined && schema.minimum > -Number.MAX_SAFE_INTEGER) bounds.push(`≥ ${schema.minimum}`);
  if (schema.exclusiveMinimum !== undefined) bounds.push(`> ${schema.exclusiveMinimum}`);
  if (schema.maximum !== undefined && schema.maximum < Number.MAX_SAFE_INTEGER) bounds.push(`≤ ${schema.maximum}`);
  if (schema.exclusiveMaximum !== undefined) bounds.push(`< ${schema.exclusiveMaximum}`);
  if (schema.maxLength !== undefined) bounds.push(`at most ${schema.maxLength} characters`);
  if (type === 'array' && schema.items) return `list of ${typeOf(schema.items)}`;
  return bounds.length > 0 ? `${type} (${bounds.join(', ')})` : type;
}

/** Every setting, depth first in the schema's order; objects with a description of their own are one row. */
export function settingRows(): SettingRow[] {
  const root = z.toJSONSchema(configSchema, { io: 'input', unrepresentable: 'any' }) as JsonSchema;
  const rows: SettingRow[] = [];
  const walk = (schema: JsonSchema, prefix: string, required: boolean) => {
    if (schema.type === 'object' && schema.properties && !schema.description) {
      for (const [name, child] of Object.entries(schema.properties))
        walk(child, prefix ? `${prefix}.${name}` : name, (schema.required ?? []).includes(name) && required);
      return;
    }
    rows.push({
      key: prefix,
      type: typeOf(schema),
      required: required && schema.default === undefined,
      default: schema.default === undefined ? '' : JSON.stringify(schema.default),
      meaning: schema.description ?? '',
    });
    // A list of objects: each field of its items gets a row of its own, as `list[].field`.
    if (schema.type === 'array' && schema.items?.type === 'object' && schema.items.properties)
      for (const [name, child] of Object.entries(schema.items.properties))
        walk(child, `${prefix}[].${name}`, (schema.items.required ?? []).includes(name));
  };
  walk(root, '', true);
  return rows;
}

const cell = (text: string) => text.replace(/\|/g, '\\|').replace(/\n/g, ' ');

export function configurationMarkdown(): string {
  const lines = [
    '# Every setting of bulletin.json',
    '',
    'Made from the configuration schema (`src/ingest/config.ts`) by `npm run docs:configuration`; a test fails when this',
    'file and the schema disagree. The formats of the tables are in [input-format.md](input-format.md).',
    '',
    '| key | type | required | default | meaning |',
    '|---|---|---|---|---|',
    ...settingRows().map(
      (row) =>
        `| \`${row.key}\` | ${cell(row.type)} | ${row.required ? 'yes' : 'no'} | ${row.default ? `\`${cell(row.default)}\`` : ''} | ${cell(row.meaning)} |`,
    ),
    '',
    'An unknown key is an error that names the nearest known key. Text settings may not hold control characters.',
    '',
  ];
  return lines.join('\n');
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const target = fileURLToPath(new URL('../../docs/configuration.md', import.meta.url));
  writeFileSync(target, configurationMarkdown());
  process.stdout.write(`wrote ${target}\n`);
}
