/** Text for XML and SVG (element content and double-quoted attributes): the one escaping used for every file the site writes outside the templates. */
export const escapeXml = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
