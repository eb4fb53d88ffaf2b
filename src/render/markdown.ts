/**
 * Per-issue editorial text: Markdown files in the issue folder's content/ (foreword.md, notes.md),
 * rendered by markdown-it with raw HTML switched off, so whatever an editor types stays text.
 */
import MarkdownIt from 'markdown-it';
import { CONTENT_FILES } from '../ingest/index.ts';

const markdown = new MarkdownIt({ html: false, linkify: false, typographer: false });

/**
 * The editorial text in one language: `<name>.<locale>.md` when the editors wrote one, else
 * `<name>.md`, which is in the first language; shown on another language's pages, it is
 * marked with its own language so screen readers switch voice.
 */
export function renderMarkdown(
  content: Record<string, string>,
  locale = 'en',
  firstLocale = locale,
): Record<(typeof CONTENT_FILES)[number], string | null> {
  const out = {} as Record<(typeof CONTENT_FILES)[number], string | null>;
  for (const name of CONTENT_FILES) {
    const own = content[`${name}.${locale}`];
    const fallback = content[name];
    const text = own ?? fallback;
    // Headings inside editorial text start below the page's own h2 sections.
    const html =
      text === undefined
        ? null
        : markdown.render(text).replace(/<(\/?)h([1-3])>/g, (_, slash: string, level: string) => `<${slash}h${Number(level) + 2}>`);
    out[name] = html !== null && own === undefined && locale !== firstLocale ? `<div lang="${firstLocale}">\n${html}</div>\n` : html;
  }
  return out;
}
