/**
 * Per-issue editorial text: Markdown files in the issue folder's content/ (foreword.md, notes.md),
 * rendered by markdown-it with raw HTML switched off, so whatever an editor types stays text.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import MarkdownIt from 'markdown-it';

const markdown = new MarkdownIt({ html: false, linkify: false, typographer: false });

export const CONTENT_FILES = ['foreword', 'notes'] as const;

export function renderMarkdown(folder: string): Record<(typeof CONTENT_FILES)[number], string | null> {
  const out = {} as Record<(typeof CONTENT_FILES)[number], string | null>;
  for (const name of CONTENT_FILES) {
    const path = join(folder, 'content', `${name}.md`);
    // Headings inside editorial text start below the page's own h2 sections.
    out[name] = existsSync(path) ? markdown.render(readFileSync(path, 'utf8')).replace(/<(\/?)h([1-3])>/g, (_, slash: string, level: string) => `<${slash}h${Number(level) + 2}>`) : null;
  }
  return out;
}
