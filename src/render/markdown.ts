/**
 * Per-issue editorial text: Markdown files in the issue folder's content/ (foreword.md, notes.md),
 * rendered by markdown-it with raw HTML switched off, so whatever an editor types stays text.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import MarkdownIt from 'markdown-it';

const markdown = new MarkdownIt({ html: false, linkify: false, typographer: false });

export const CONTENT_FILES = ['foreword', 'notes'] as const;

/**
 * The editorial text in one language: `<name>.<locale>.md` when the editors wrote one, else
 * `<name>.md`, which is in the first language; shown on another language's pages, it is
 * marked with its own language so screen readers switch voice.
 */
export function renderMarkdown(folder: string, locale = 'en', firstLocale = locale): Record<(typeof CONTENT_FILES)[number], string | null> {
  const out = {} as Record<(typeof CONTENT_FILES)[number], string | null>;
  for (const name of CONTENT_FILES) {
    const own = join(folder, 'content', `${name}.${locale}.md`);
    const fallback = join(folder, 'content', `${name}.md`);
    const path = existsSync(own) ? own : existsSync(fallback) ? fallback : null;
    // Headings inside editorial text start below the page's own h2 sections.
    const html = path === null ? null : markdown.render(readFileSync(path, 'utf8')).replace(/<(\/?)h([1-3])>/g, (_, slash: string, level: string) => `<${slash}h${Number(level) + 2}>`);
    out[name] = html !== null && path === fallback && locale !== firstLocale ? `<div lang="${firstLocale}">\n${html}</div>\n` : html;
  }
  return out;
}
